// Site admins read what the local SMTP fake caught; the page exists only while the fake is in use.
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { useSession } from "@/features/accounts/api/get-session";
import { useMail } from "@/features/accounts/api/list-mail";
import { MailboxList } from "@/features/accounts/components/mailbox-list";

export function MailboxRoute() {
  const { data: session } = useSession();
  const [to, setTo] = useState("");
  const isAllowed = session?.mailboxAvailable === true;
  if (!isAllowed) return <Alert>The mailbox is for site administrators while the local mail fake is in use.</Alert>;
  return <MailboxContent to={to} setTo={setTo} />;
}

function MailboxContent({ to, setTo }: { to: string; setTo: (v: string) => void }) {
  const { data: messages, error, isPending } = useMail(to.trim());
  return (
    <section className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold">Mailbox</h1>
          <p className="text-sm text-slate-600">Mail caught by the local SMTP fake. Nothing here left this machine.</p>
        </div>
        <label className="text-sm">
          <span className="mb-1 block font-medium text-slate-700">Recipient</span>
          <input
            type="search"
            value={to}
            onChange={(e) => setTo(e.target.value)}
            placeholder="someone@example.org"
            className="w-72 rounded-md border border-slate-300 px-3 py-2 text-sm shadow-sm"
          />
        </label>
      </div>
      {isPending ? (
        <p className="text-sm text-slate-500">Loading…</p>
      ) : error ? (
        <Alert>{error.message}</Alert>
      ) : (
        <MailboxList messages={messages} />
      )}
    </section>
  );
}
