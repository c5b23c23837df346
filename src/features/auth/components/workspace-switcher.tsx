import { useLocation, useNavigate } from 'react-router-dom';
import type { SessionWorkspace } from '@shared/schemas/session';
import { Select } from '@/components/select';
import { rememberWorkspace } from '../last-workspace';

/** Picks the workspace; keeps the same section (members, compounds ...) when switching. */
export function WorkspaceSwitcher({
  workspaces,
  currentId,
}: {
  workspaces: SessionWorkspace[];
  currentId: string | undefined;
}) {
  const navigate = useNavigate();
  const location = useLocation();
  const current = workspaces.find((w) => w.id === currentId) ?? workspaces[0];
  if (!current) return null;
  if (workspaces.length < 2) {
    return (
      <div className="px-1">
        <p className="text-caption text-ink-faint">Workspace</p>
        <p className="text-body leading-snug font-medium text-ink">{current.name}</p>
      </div>
    );
  }
  return (
    <Select
      label="Workspace"
      value={current.id}
      // A long name is cut off in the narrow rail; the tooltip shows all of it.
      title={current.name}
      options={workspaces.map((w) => ({ value: w.id, label: w.name }))}
      onValueChange={(id) => {
        const prefix = `/w/${encodeURIComponent(current.id)}`;
        const rest = location.pathname.startsWith(prefix)
          ? location.pathname.slice(prefix.length)
          : '';
        // Remembered now, not in the next page's effect: "/" opened right after
        // the switch must already find the new choice.
        rememberWorkspace(id);
        navigate(`/w/${encodeURIComponent(id)}${rest}`);
      }}
      className="[&_label]:text-caption [&_label]:font-normal [&_label]:text-ink-faint"
    />
  );
}
