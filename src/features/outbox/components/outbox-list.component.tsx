import { Fragment } from 'react';
import type { OutboxMessage } from '../api/get-outbox.api';

const dateFormat = new Intl.DateTimeFormat(undefined, {
  year: 'numeric',
  month: 'short',
  day: '2-digit',
  hour: '2-digit',
  minute: '2-digit',
  second: '2-digit',
});

const URL_PATTERN = /(https?:\/\/[^\s<>"]+)/g;

/** The plain-text body with every address turned into a link that opens in this tab. */
function TextWithLinks({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <>
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <a key={i} href={part} className="break-all font-medium text-accent underline underline-offset-2">
            {part}
          </a>
        ) : (
          <Fragment key={i}>{part}</Fragment>
        ),
      )}
    </>
  );
}

export function OutboxList({ messages }: { messages: OutboxMessage[] }) {
  return (
    <ol aria-label="Messages" className="flex flex-col gap-4">
      {messages.map((m) => (
        <li key={m.id}>
          <article aria-label={m.subject} className="border border-ink/80 bg-paper-raised">
            <header className="grid gap-x-4 gap-y-1 border-b border-ink/80 bg-paper-sunk/60 px-4 py-2.5 text-sm sm:grid-cols-[4rem_1fr]">
              <span className="label-caps">To</span>
              <span className="font-medium">{m.to}</span>
              <span className="label-caps">Subject</span>
              <span>{m.subject}</span>
              <span className="label-caps">Sent</span>
              <time dateTime={m.sentAt} className="figures text-ink-soft">
                {dateFormat.format(new Date(m.sentAt))}
              </time>
            </header>
            <pre className="whitespace-pre-wrap px-4 py-3 font-sans text-sm leading-relaxed text-ink">
              <TextWithLinks text={m.text} />
            </pre>
          </article>
        </li>
      ))}
    </ol>
  );
}
