import { useState } from "react";
import type { ReceivedMail } from "@shared/schemas/dev-mail";
import { Alert } from "@/components/ui/alert";
import { ApiRequestError } from "@/lib/api-client";
import { useReceivedMail } from "../api/list-received-mail";

const time = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", second: "2-digit" });

function MessageView({ message }: { message: ReceivedMail }) {
  return (
    <article aria-labelledby={`mail-${message.id}`} className="min-w-0 rounded-2xl border-2 border-line bg-shell p-5">
      <h2 id={`mail-${message.id}`} className="text-2xl">
        {message.subject || "(no subject)"}
      </h2>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
        <dt className="font-bold">From</dt>
        <dd className="break-all">{message.from}</dd>
        <dt className="font-bold">To</dt>
        <dd className="break-all">{message.to.join(", ")}</dd>
        <dt className="font-bold">Received</dt>
        <dd>{time.format(new Date(message.receivedAt))}</dd>
      </dl>
      {message.links.length > 0 && (
        <section aria-label="Links in this message" className="mt-4">
          <h3 className="text-lg">Links</h3>
          <ul className="mt-1 flex flex-col gap-1">
            {message.links.map((link) => (
              <li key={link}>
                <a href={link} className="break-all font-bold text-tide underline">
                  {link}
                </a>
              </li>
            ))}
          </ul>
        </section>
      )}
      <h3 className="mt-4 text-lg">Text</h3>
      <pre className="mt-1 whitespace-pre-wrap break-words rounded-xl border-2 border-line bg-white p-3 font-sans text-base">
        {message.text}
      </pre>
      {message.html && (
        <details className="mt-4">
          <summary className="cursor-pointer font-bold text-tide">Show the HTML version</summary>
          <iframe
            title={`HTML version of “${message.subject}”`}
            sandbox=""
            srcDoc={message.html}
            className="mt-2 h-96 w-full rounded-xl border-2 border-line bg-white"
          />
        </details>
      )}
    </article>
  );
}

/** The development mail page: every message the local fake mail server received, newest first. */
export function ReceivedMailPage() {
  const mail = useReceivedMail();
  const [chosenId, setChosenId] = useState<string | null>(null);
  if (mail.isPending) return <p role="status">Loading received mail…</p>;
  if (mail.isError) {
    const off = mail.error instanceof ApiRequestError && mail.error.status === 404;
    return (
      <Alert tone={off ? "info" : "error"} title={off ? "No local mail here" : "Received mail could not be loaded"}>
        {off
          ? "This server sends real e-mail (SMTP_URL is set), or you are not on the machine it runs on, so there is no local mailbox to show."
          : mail.error.message}
      </Alert>
    );
  }
  const messages = mail.data.messages;
  if (messages.length === 0) {
    return (
      <p className="rounded-2xl border-2 border-dashed border-line bg-shell p-6 text-lg text-ink-soft">
        No mail yet. Invite a colleague or ask for a password reset, and it appears here.
      </p>
    );
  }
  const chosen = messages.find((message) => message.id === chosenId) ?? messages[0];
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(16rem,1fr)_minmax(0,2fr)]">
      <ul aria-label="Received messages" className="flex min-w-0 flex-col gap-2">
        {messages.map((message) => {
          const active = message.id === chosen.id;
          return (
            <li key={message.id}>
              <button
                type="button"
                aria-current={active || undefined}
                onClick={() => setChosenId(message.id)}
                className={`w-full rounded-xl border-2 px-3 py-2 text-left ${active ? "border-tide bg-tide-light" : "border-line bg-white hover:border-ink/40"}`}
              >
                <span className="block font-bold">{message.subject || "(no subject)"}</span>
                <span className="block break-all text-sm text-ink-soft">To {message.to.join(", ")}</span>
                <span className="block text-sm text-ink-soft">{time.format(new Date(message.receivedAt))}</span>
              </button>
            </li>
          );
        })}
      </ul>
      <MessageView message={chosen} />
    </div>
  );
}
