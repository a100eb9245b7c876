import { useMailbox } from '../api/get-mailbox';
import { fmtTime } from '../../../lib/format-time';
import { Loading, QueryError } from '../../../components/ui/query-state';

/** Dev and demo only: the mails the local fake mail server caught. Links in them are clickable. */
export function MailboxPage() {
  const box = useMailbox();
  return (
    <section className="mx-auto max-w-4xl px-4 py-6">
      <h1 className="text-2xl font-semibold">Dev mailbox</h1>
      <p className="text-sm text-ink-soft">Mail sent by this Dwellform instance to the local fake mail server. Nothing here left the machine.</p>
      {box.isPending && <Loading what="the mailbox" />}
      {box.isError && <QueryError error={box.error} what="the mailbox" />}
      {box.data?.length === 0 && <p className="mt-4 text-ink-soft">No mail yet. Invite someone from a team's members page and it appears here.</p>}
      <ul className="mt-4 space-y-3">
        {box.data?.map((m) => (
          <li key={m.id} className="rounded border border-rule bg-paper-raised p-3" data-testid="mail">
            <p className="text-sm"><span className="text-ink-faint">To</span> {m.to.join(', ')} · <span className="text-ink-faint">{fmtTime(m.receivedAt)}</span></p>
            <p className="font-medium">{m.subject}</p>
            <p className="mt-1 whitespace-pre-wrap text-sm">
              {m.text.split(/(https?:\/\/\S+)/).map((part, i) =>
                /^https?:\/\//.test(part) ? <a key={i} className="text-slate underline" href={new URL(part).pathname}>{part}</a> : part,
              )}
            </p>
          </li>
        ))}
      </ul>
    </section>
  );
}
