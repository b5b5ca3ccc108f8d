import { splitLinks } from '@/lib/linkify';

/**
 * Caught mail is rendered as text only: addresses become links, nothing in the body is
 * ever interpreted as HTML.
 */
export function MailBody({ text }: { text: string }) {
  return (
    <pre className="num overflow-x-auto rounded-control border border-paper-300 bg-paper-100 p-3 text-sm whitespace-pre-wrap break-words text-ink-900">
      {splitLinks(text).map((part, i) =>
        part.kind === 'url' ? (
          <a key={i} href={part.text} className="text-blueend-700 underline underline-offset-2">
            {part.text}
          </a>
        ) : (
          <span key={i}>{part.text}</span>
        ),
      )}
    </pre>
  );
}
