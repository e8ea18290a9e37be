// Messages caught by the local SMTP fake, newest first, each opening to its text with links made clickable.
import { useState } from "react";
import type { MailMessage } from "@shared/schemas/accounts";

function Linkified({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s]+)/g);
  return (
    <pre className="whitespace-pre-wrap break-words font-sans text-sm text-slate-800">
      {parts.map((part, i) =>
        /^https?:\/\//.test(part) ? (
          <a key={i} href={part} className="text-brand-700 underline" data-testid="mail-link">
            {part}
          </a>
        ) : (
          part
        ),
      )}
    </pre>
  );
}

export function MailboxList({ messages }: { messages: readonly MailMessage[] }) {
  const [openId, setOpenId] = useState<string | null>(messages[0]?.id ?? null);
  if (messages.length === 0) {
    return (
      <p className="rounded-md border border-dashed border-slate-300 bg-white p-6 text-center text-sm text-slate-600">
        No mail has been sent yet.
      </p>
    );
  }
  return (
    <ul className="divide-y divide-slate-200 rounded-lg border border-slate-200 bg-white" data-testid="mailbox">
      {messages.map((m) => (
        <li key={m.id}>
          <button
            type="button"
            className="flex w-full flex-wrap items-baseline gap-x-4 px-4 py-3 text-left hover:bg-slate-50"
            aria-expanded={openId === m.id}
            onClick={() => setOpenId(openId === m.id ? null : m.id)}
          >
            <span className="font-medium text-slate-900">{m.subject || "(no subject)"}</span>
            <span className="text-sm text-slate-600">to {m.to.join(", ")}</span>
            <time className="ml-auto text-xs text-slate-500" dateTime={m.receivedAt}>
              {new Date(m.receivedAt).toLocaleString()}
            </time>
          </button>
          {openId === m.id && (
            <div className="border-t border-slate-100 bg-slate-50 px-4 py-3">
              <p className="mb-2 text-xs text-slate-500">From {m.from}</p>
              <Linkified text={m.textBody} />
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
