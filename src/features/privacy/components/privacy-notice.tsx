import type { ReactNode } from "react";
import { INVITATION_DAYS, SESSION_DAYS, type PrivacyController } from "@shared/schemas/privacy";
import { PASSWORD_RESET_MINUTES } from "@shared/schemas/password-reset";
import { Alert } from "@/components/ui/alert";
import { usePrivacySettings } from "../api/get-privacy-settings";

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="rounded-2xl border-2 border-line bg-shell p-5 sm:p-6">
      <h2 id={id} className="mb-3 text-2xl">
        {title}
      </h2>
      <div className="flex flex-col gap-3 leading-relaxed">{children}</div>
    </section>
  );
}

/** One row of a "what / how long / who sees it" table, read as a list on a phone. */
type StoredItem = { what: string; detail: string; kept: string; seenBy: string };

function StoredTable({ caption, items }: { caption: string; items: StoredItem[] }) {
  return (
    <>
      {/* On a phone each row reads as a short card instead of a table that scrolls sideways. */}
      <ul aria-label={caption} className="flex flex-col gap-3 sm:hidden">
        {items.map((item) => (
          <li key={item.what} className="rounded-xl border-2 border-line bg-white p-3">
            <p className="font-bold">{item.what}</p>
            <p className="text-ink-soft">{item.detail}</p>
            <dl className="mt-2 grid gap-1">
              <div>
                <dt className="inline font-bold">Kept: </dt>
                <dd className="inline">{item.kept}</dd>
              </div>
              <div>
                <dt className="inline font-bold">Who can see it: </dt>
                <dd className="inline">{item.seenBy}</dd>
              </div>
            </dl>
          </li>
        ))}
      </ul>
      <table className="hidden w-full border-collapse text-left sm:table">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b-2 border-line">
            <th scope="col" className="py-2 pr-3">
              What
            </th>
            <th scope="col" className="py-2 pr-3">
              Kept
            </th>
            <th scope="col" className="py-2">
              Who can see it
            </th>
          </tr>
        </thead>
        <tbody>
          {items.map((item) => (
            <tr key={item.what} className="border-b border-line align-top">
              <th scope="row" className="py-2 pr-3 font-normal">
                <span className="font-bold">{item.what}</span>
                <span className="block text-ink-soft">{item.detail}</span>
              </th>
              <td className="py-2 pr-3">{item.kept}</td>
              <td className="py-2">{item.seenBy}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}

const pupilItems: StoredItem[] = [
  {
    what: "Group nickname",
    detail: "Made up by the group when it joins a class run.",
    kept: "Until the teacher deletes the run.",
    seenBy: "The class (on the Wall view), the teacher and their head of department.",
  },
  {
    what: "Rolls and Guess votes",
    detail: "The faces rolled, totals, the time, and whether a roll came from a phone, the Virtual class or a paper sheet.",
    kept: "Until the teacher deletes the run.",
    seenBy: "The teacher and their head of department; pooled figures are shown to the class.",
  },
  {
    what: "On the group's phone",
    detail: "The group's pass for the run and rolls not yet delivered, in the browser's own storage.",
    kept: "At most until the browser's site data is cleared.",
    seenBy: "Whoever holds the phone.",
  },
];

const teacherItems: StoredItem[] = [
  {
    what: "Account",
    detail: "Name, school e-mail address, the password (only as a one-way hash), department and role.",
    kept: "While the account exists.",
    seenBy: "Colleagues in your department see your name and e-mail address.",
  },
  {
    what: "Signed-in sessions",
    detail: "A session cookie, with the browser's address (IP) and browser name stored beside it.",
    kept: `${SESSION_DAYS} days after last use.`,
    seenBy: "Nobody in the app; the operator's staff can read the database.",
  },
  {
    what: "Invitations and password-reset links",
    detail: "The invited e-mail address and who invited; a reset link's one-time code.",
    kept: `An invitation works ${INVITATION_DAYS} days and stays listed for the head; a reset link works ${PASSWORD_RESET_MINUTES} minutes.`,
    seenBy: "The head of department (invitations).",
  },
  {
    what: "Your work",
    detail: "Dice sets, lessons and their attached files, class runs and their results.",
    kept: "Until you delete it.",
    seenBy: "You; your head of department reads your lessons and runs; what you share with the department, your colleagues.",
  },
  {
    what: "Department shelf",
    detail:
      "Templates with the names of who published them and whose proposal they came from; proposals and decisions; the days a head was sent a proposal digest.",
    kept: "While the template or proposal exists.",
    seenBy: "Members of your department.",
  },
];

function ControllerContact({ controller }: { controller: PrivacyController }) {
  return (
    <address className="not-italic">
      <p className="text-lg font-bold">{controller.name}</p>
      {controller.email && (
        <p>
          E-mail:{" "}
          <a href={`mailto:${controller.email}`} className="font-bold text-tide underline">
            {controller.email}
          </a>
        </p>
      )}
      {controller.postalAddress && <p className="whitespace-pre-line">{controller.postalAddress}</p>}
    </address>
  );
}

/** The public privacy notice: what Outroll keeps about pupils and teachers, for how long, who sees it, how to delete it. */
export function PrivacyNotice() {
  const settings = usePrivacySettings();
  const controller = settings.data?.controller ?? null;
  return (
    <div className="flex flex-col gap-6">
      <Section id="controller-heading" title="Who is responsible">
        <p>
          The school or organisation that runs this Outroll decides what it is used for and is responsible for the data it holds (the
          controller). Ask them anything about this notice, or to see, correct or delete data.
        </p>
        {settings.isPending && <p role="status">Loading the contact…</p>}
        {settings.isError && (
          <Alert tone="error" title="The contact could not be loaded">
            {settings.error.message}
          </Alert>
        )}
        {settings.data &&
          (controller ? (
            <ControllerContact controller={controller} />
          ) : (
            <Alert tone="caution" title="No contact set yet">
              Whoever runs this Outroll has not named its controller here yet. Until they do, ask your teacher or head of department.
            </Alert>
          ))}
      </Section>

      <Section id="pupils-heading" title="Pupils">
        <p>
          Pupils are children, so Outroll asks them for nothing about themselves: no account, no name, no e-mail address, no phone number. A
          group joins a class run with a join code and a made-up nickname; please do not use real names.
        </p>
        <StoredTable caption="What Outroll keeps about pupils" items={pupilItems} />
        <p>
          <span className="font-bold">To delete it:</span> the teacher presses <span className="font-bold">Delete run</span> on the
          run&rsquo;s page; the run goes at once with all its groups, nicknames, rolls and votes. If a group used a real name, tell the
          teacher. Deleting a lesson does not delete its runs.
        </p>
      </Section>

      <Section id="teachers-heading" title="Teachers and heads of department">
        <StoredTable caption="What Outroll keeps about teachers" items={teacherItems} />
        <p>
          <span className="font-bold">E-mail</span> goes only to teachers: invitations, password-reset links and, for a head of department,
          at most one digest a day while colleagues&rsquo; proposals wait for a decision.
        </p>
        <p>
          <span className="font-bold">To delete it:</span> delete your dice sets, lessons, attachments and runs in the app. To have your
          account removed, ask the controller above; there is no button for it in the app yet.
        </p>
      </Section>

      <Section id="never-heading" title="What Outroll does not do">
        <ul className="list-disc pl-6">
          <li>No advertising, no tracking and no analytics services; nothing is sold or shared with anyone else.</li>
          <li>The only cookie is a teacher&rsquo;s sign-in session. Pupils&rsquo; phones get no cookie.</li>
          <li>Fonts and code come from this Outroll itself, not from other sites.</li>
          <li>The server&rsquo;s logs record which address was asked for and the answer&rsquo;s status, not who asked or what was sent.</li>
        </ul>
      </Section>
    </div>
  );
}
