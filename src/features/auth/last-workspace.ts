const KEY = 'phasewright.lastWorkspace';

/** Remembers the workspace a person last worked in, so "/" opens it again. */
export function rememberWorkspace(id: string) {
  try {
    localStorage.setItem(KEY, id);
  } catch {
    /* private mode: nothing to remember */
  }
}

export function lastWorkspace(): string | null {
  try {
    return localStorage.getItem(KEY);
  } catch {
    return null;
  }
}
