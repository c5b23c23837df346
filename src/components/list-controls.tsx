import { useEffect, useId, useState } from 'react';
import { Button } from './button';
import { inputClass } from './text-field';

/** How long typing rests before a search goes to the server. */
export const SEARCH_PAUSE_MS = 250;

/**
 * A search box whose text goes to the server once typing rests; `onSearch`
 * gets the trimmed text.
 */
export function ListSearch({
  label,
  placeholder,
  onSearch,
}: {
  label: string;
  placeholder: string;
  onSearch: (q: string) => void;
}) {
  const id = useId();
  const [text, setText] = useState('');
  useEffect(() => {
    const timer = setTimeout(() => onSearch(text.trim()), SEARCH_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [text, onSearch]);
  return (
    <div className="w-72 space-y-1">
      <label htmlFor={id} className="block text-small font-medium text-ink">
        {label}
      </label>
      <input
        id={id}
        type="search"
        value={text}
        onChange={(e) => setText(e.target.value)}
        placeholder={placeholder}
        className={`${inputClass} border-rule-strong`}
      />
    </div>
  );
}

/** How many rows are shown, and the button that asks the server for the next page. */
export function ListMore({
  shown,
  noun,
  hasMore,
  loading,
  onMore,
}: {
  shown: number;
  noun: [singular: string, plural: string];
  hasMore: boolean;
  loading: boolean;
  onMore: () => void;
}) {
  return (
    <div className="flex items-center gap-3">
      <p className="text-small text-ink-muted" aria-live="polite">
        {shown} {shown === 1 ? noun[0] : noun[1]} shown{hasMore ? ', more below' : ''}
      </p>
      {hasMore ? (
        <Button variant="secondary" busy={loading} onClick={onMore}>
          Show more {noun[1]}
        </Button>
      ) : null}
    </div>
  );
}
