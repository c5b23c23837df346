import { useId } from 'react';
import { ROLES, ROLE_LABELS, type Role } from '@shared/schemas/session';
import { cn } from './cn';
import { FieldError } from './text-field';

export const ROLE_HINTS: Record<Role, string> = {
  admin: 'Manages the workspace, members and roles',
  chemist: 'Builds routes and submits revisions',
  reviewer: 'Comments on, returns or approves revisions',
  engineer: 'Sets batch size and vessels, exports step lists',
};

type RolePickerProps = {
  legend: string;
  value: Role[];
  onChange: (roles: Role[]) => void;
  error?: string;
  /** Compact: one line of checkboxes without hints, for table rows. */
  compact?: boolean;
};

/** Role checkboxes: one person may hold several roles. */
export function RolePicker({ legend, value, onChange, error, compact }: RolePickerProps) {
  const id = useId();
  const toggle = (role: Role, on: boolean) =>
    onChange(
      on ? ROLES.filter((r) => r === role || value.includes(r)) : value.filter((r) => r !== role),
    );
  return (
    <fieldset aria-describedby={error ? `${id}-error` : undefined} className="space-y-1.5">
      <legend className={cn('text-small font-medium text-ink', compact && 'sr-only')}>
        {legend}
      </legend>
      <div className={cn(compact ? 'flex flex-wrap gap-x-4 gap-y-1' : 'grid gap-1.5')}>
        {ROLES.map((role) => (
          <label key={role} className="flex cursor-pointer items-start gap-2 text-body">
            <input
              type="checkbox"
              className="mt-0.5 size-4 accent-accent"
              checked={value.includes(role)}
              onChange={(e) => toggle(role, e.target.checked)}
            />
            <span>
              <span className="font-medium">{ROLE_LABELS[role]}</span>
              {compact ? null : (
                <span className="block text-caption text-ink-muted">{ROLE_HINTS[role]}</span>
              )}
            </span>
          </label>
        ))}
      </div>
      {error ? <FieldError id={`${id}-error`}>{error}</FieldError> : null}
    </fieldset>
  );
}

export function RoleBadges({ roles }: { roles: Role[] }) {
  return (
    <span className="inline-flex flex-wrap gap-1">
      {roles.map((role) => (
        <span
          key={role}
          className="rounded-control border border-rule bg-paper-sunken px-1.5 py-px text-caption font-medium text-ink-muted"
        >
          {ROLE_LABELS[role]}
        </span>
      ))}
    </span>
  );
}
