import { Component, type ErrorInfo, type ReactNode } from 'react';

type State = { error: Error | null };

/** The last line: a fault outside any route still leaves a readable page. */
export class AppErrorBoundary extends Component<{ children: ReactNode }, State> {
  override state: State = { error: null };

  static getDerivedStateFromError(error: Error): State {
    return { error };
  }

  override componentDidCatch(error: Error, info: ErrorInfo) {
    console.error('Phasewright stopped on an error', error, info.componentStack);
  }

  override render() {
    if (!this.state.error) return this.props.children;
    return <CrashPage message={this.state.error.message} />;
  }
}

export function CrashPage({ message }: { message?: string }) {
  return (
    <main className="mx-auto mt-24 max-w-form px-6">
      <h1 className="text-heading font-semibold text-ink">Something went wrong</h1>
      <p className="mt-2 text-body text-ink-muted">
        The page stopped on an unexpected error. Your saved work is on the server; reloading usually
        helps.
      </p>
      {message ? (
        <pre className="mt-3 overflow-x-auto rounded-control bg-paper-sunken p-3 text-small text-ink">
          {message}
        </pre>
      ) : null}
      <button
        type="button"
        onClick={() => window.location.reload()}
        className="mt-4 h-9 rounded-control bg-accent px-3.5 text-body font-medium text-ink-inverse hover:bg-accent-deep"
      >
        Reload the page
      </button>
    </main>
  );
}
