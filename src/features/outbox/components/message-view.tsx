import type { ApiMail } from '../../../../shared/api';
import { formatDateTime } from '../../../lib/format';
import { linkify } from '../../../lib/linkify';

/**
 * The HTML body in a sandboxed frame: no scripts, no same-origin access, nothing loaded from the
 * network (CSP), and links open in a new tab — so a mail can never act inside the app.
 */
function htmlDocument(html: string): string {
  return `<!doctype html><html><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; img-src data:; style-src 'unsafe-inline'">
<base target="_blank">
<style>body{font:14px/1.5 system-ui,sans-serif;color:#1a2028;background:#fff;margin:16px}a{color:#b45309}</style>
</head><body>${html}</body></html>`;
}

function Header({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex gap-3 text-sm">
      <dt className="w-16 shrink-0 text-slate-500">{label}</dt>
      <dd className="min-w-0 break-all font-mono text-xs leading-5 text-slate-200">{value}</dd>
    </div>
  );
}

export function MessageView({ message }: { message: ApiMail }) {
  return (
    <article className="flex flex-col gap-5" aria-label={message.subject}>
      <div>
        <h1 className="text-lg font-semibold text-slate-100">{message.subject || '(no subject)'}</h1>
        <dl className="mt-3 flex flex-col gap-1">
          <Header label="From" value={message.from} />
          <Header label="To" value={message.to} />
          <Header label="Date" value={formatDateTime(message.date)} />
        </dl>
      </div>
      <section aria-label="Text" className="rounded-lg border border-mat-700 bg-mat-950/80 p-4">
        <pre className="whitespace-pre-wrap break-words font-mono text-[13px] leading-relaxed text-slate-200" data-testid="message-text">
          {linkify(message.text || '').map((p, i) =>
            p.kind === 'link' ? (
              <a key={i} href={p.href} className="text-amber-300 underline decoration-amber-600/60 hover:text-amber-glow">
                {p.href}
              </a>
            ) : (
              <span key={i}>{p.text}</span>
            ),
          )}
        </pre>
      </section>
      {message.html && (
        <section aria-label="HTML version" className="flex flex-col gap-2">
          <h2 className="text-xs font-semibold uppercase tracking-wide text-slate-400">HTML version</h2>
          <iframe
            title="HTML version of the message"
            sandbox="allow-popups allow-popups-to-escape-sandbox"
            srcDoc={htmlDocument(message.html)}
            className="h-96 w-full rounded-lg border border-mat-700 bg-white"
          />
        </section>
      )}
    </article>
  );
}
