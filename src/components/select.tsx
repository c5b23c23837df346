import { useId, type SelectHTMLAttributes } from 'react';
import { cn } from './cn';

type SelectProps = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'onChange'> & {
  label: string;
  hideLabel?: boolean;
  options: Array<{ value: string; label: string }>;
  onValueChange: (value: string) => void;
};

export function Select({
  label,
  hideLabel,
  options,
  onValueChange,
  className,
  id,
  ...rest
}: SelectProps) {
  const autoId = useId();
  const selectId = id ?? autoId;
  return (
    <div className={cn(hideLabel ? '' : 'space-y-1', className)}>
      <label
        htmlFor={selectId}
        className={hideLabel ? 'sr-only' : 'block text-small font-medium text-ink'}
      >
        {label}
      </label>
      <select
        id={selectId}
        onChange={(e) => onValueChange(e.target.value)}
        className="block h-8 w-full rounded-control border border-rule-strong bg-paper-raised px-2 text-body text-ink focus-visible:outline-2 focus-visible:outline-accent disabled:cursor-not-allowed disabled:border-rule disabled:bg-paper-sunken disabled:text-ink-muted read-only:border-rule read-only:bg-paper-sunken"
        {...rest}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}
