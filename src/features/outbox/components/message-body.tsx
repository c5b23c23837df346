import { Fragment } from 'react';

const URL_PATTERN = /(https?:\/\/[^\s<>"')]+)/g;

/** The plain-text body with its links made clickable (the HTML part is never injected). */
export function MessageBody({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <pre className="font-sans text-body whitespace-pre-wrap text-ink">
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <a
            key={i}
            href={part}
            className="break-all font-medium text-accent underline underline-offset-2 hover:text-accent-deep"
          >
            {part}
          </a>
        ) : (
          <Fragment key={i}>{part}</Fragment>
        ),
      )}
    </pre>
  );
}
