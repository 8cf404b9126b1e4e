import { useEffect, useState, type FormEvent } from "react";
import { joinCodeSchema, NICKNAME_MAX, NICKNAME_MIN } from "@shared/schemas/joining";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { usePadRun } from "../api/get-pad-run";
import { joinGroup, JoinRefusedError } from "../api/join-group";
import { storedPadSession, storePadSession, type PadSession } from "../delivery/pad-connection";
import { GroupPad } from "./group-pad";
import { PadFrame } from "./pad-frame";

// The server checks nicknames in full (rude words, look-alikes, personal data); the pad checks only their length,
// so it loads no word lists.
function nicknameLengthProblem(nickname: string): string | null {
  const trimmed = nickname.trim().replace(/\s+/g, " ");
  if (trimmed.length === 0) return "Choose a group nickname.";
  if (trimmed.length < NICKNAME_MIN) return `A group nickname needs at least ${NICKNAME_MIN} characters.`;
  if (trimmed.length > NICKNAME_MAX) return `Keep the group nickname to ${NICKNAME_MAX} characters or fewer.`;
  return null;
}

function CodeBox({ initial, onCode }: { initial?: string; onCode: (code: string) => void }) {
  const [value, setValue] = useState(initial ?? "");
  const [problem, setProblem] = useState<string | undefined>();
  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = joinCodeSchema.safeParse(value);
    if (parsed.success) onCode(parsed.data);
    else setProblem(parsed.error.issues[0]?.message);
  };
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-label="Find a class run by its code">
      <TextField
        label="Join code"
        hint="Six letters and numbers, shown on the board at the front."
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
        inputMode="text"
        className="[&_input]:min-h-14 [&_input]:text-center [&_input]:font-mono [&_input]:text-3xl [&_input]:tracking-[0.3em] [&_input]:uppercase"
        value={value}
        onChange={(event) => setValue(event.target.value)}
        error={problem}
      />
      <Button type="submit" className="min-h-14 text-xl">
        Find the class run
      </Button>
    </form>
  );
}

function NicknameForm({ code, title, onJoined }: { code: string; title: string; onJoined: (session: PadSession) => void }) {
  const [nickname, setNickname] = useState("");
  const [fieldProblem, setFieldProblem] = useState<string | undefined>();
  const [refusal, setRefusal] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [blockedUntil, setBlockedUntil] = useState(0);
  const [, setTick] = useState(0);

  // socket.io's client is not needed to show this form; fetch it while the group chooses its nickname.
  useEffect(() => {
    void import("@/lib/socket");
  }, []);

  // While a wait from rate_limited runs, count it down so the button comes back by itself.
  useEffect(() => {
    if (blockedUntil <= Date.now()) return;
    const timer = setInterval(() => setTick((tick) => tick + 1), 1_000);
    const done = setTimeout(() => setBlockedUntil(0), blockedUntil - Date.now());
    return () => {
      clearInterval(timer);
      clearTimeout(done);
    };
  }, [blockedUntil]);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    if (busy || blockedUntil > Date.now()) return;
    const problem = nicknameLengthProblem(nickname);
    setFieldProblem(problem ?? undefined);
    if (problem) return;
    setBusy(true);
    setRefusal(null);
    try {
      onJoined(await joinGroup({ code, nickname: nickname.trim().replace(/\s+/g, " ") }));
    } catch (error) {
      const refused = error instanceof JoinRefusedError ? error : new JoinRefusedError("server_error", "Not joined yet: try again.");
      if (refused.code === "nickname_taken" || refused.code === "invalid_input") setFieldProblem(refused.message);
      else setRefusal(refused.message);
      if (refused.code === "rate_limited") setBlockedUntil(Date.now() + (refused.retryAfterMs ?? 30_000));
      setBusy(false);
    }
  };
  const secondsLeft = Math.ceil((blockedUntil - Date.now()) / 1000);
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-label="Choose a group nickname">
      <h1 className="text-2xl">{title}</h1>
      <Alert tone="caution" title="Made-up names only">
        Choose a made-up group nickname, like “Rockpool Rangers”. Do not use anyone’s real name, e-mail or phone number.
      </Alert>
      <TextField
        label="Group nickname"
        hint={`2 to ${NICKNAME_MAX} characters.`}
        autoComplete="off"
        maxLength={NICKNAME_MAX + 8}
        className="[&_input]:min-h-14 [&_input]:text-xl"
        value={nickname}
        onChange={(event) => setNickname(event.target.value)}
        error={fieldProblem}
      />
      {refusal && (
        <Alert tone="error" title="Not joined yet">
          {refusal}
        </Alert>
      )}
      <Button type="submit" busy={busy} disabled={secondsLeft > 0} className="min-h-14 text-xl">
        {secondsLeft > 0 ? `Try again in ${secondsLeft} s` : "Join with this nickname"}
      </Button>
    </form>
  );
}

/** The code in a /pad/CODE address, or null on /pad. */
export function codeFromPath(pathname: string): string | null {
  const match = /^\/pad\/([^/]+)\/?$/.exec(pathname);
  return match ? decodeURIComponent(match[1]) : null;
}

/** The pad's own tiny history: /pad and /pad/CODE, without a router library. */
function usePadPath() {
  const [code, setCode] = useState(() => codeFromPath(window.location.pathname));
  useEffect(() => {
    const onPop = () => setCode(codeFromPath(window.location.pathname));
    window.addEventListener("popstate", onPop);
    return () => window.removeEventListener("popstate", onPop);
  }, []);
  const go = (next: string | null) => {
    window.history.pushState(null, "", next ? `/pad/${next}` : "/pad");
    setCode(next);
  };
  return [code, go] as const;
}

/**
 * The Roll pad: type or scan the join code, choose a nickname, then vote and record rolls. The group's token is kept
 * in this phone's storage, so a reload or a dropped connection comes back to the same group.
 */
export function RollPad() {
  const [code, go] = usePadPath();
  const [session, setSession] = useState<PadSession | null>(() => {
    const stored = storedPadSession();
    return stored && (code === null || stored.code === code) ? stored : null;
  });
  const parsedCode = code === null ? null : joinCodeSchema.safeParse(code);
  const validCode = parsedCode?.success ? parsedCode.data : null;
  const run = usePadRun(session ? null : validCode);

  if (session) {
    return (
      <GroupPad
        key={session.token}
        session={session}
        onLeave={() => {
          if (storedPadSession()?.token === session.token) storePadSession(null);
          setSession(null);
          go(null);
        }}
      />
    );
  }

  const remembered = storedPadSession();
  return (
    <PadFrame>
      {remembered && (
        <div className="rounded-2xl border-4 border-tide bg-tide-light p-4">
          <p className="font-bold">This phone is in the group “{remembered.nickname}”.</p>
          <Button className="mt-3 w-full" onClick={() => setSession(remembered)}>
            Go back to {remembered.nickname}
          </Button>
        </div>
      )}
      {code === null || !validCode ? (
        <>
          <h1 className="text-3xl">Join your class</h1>
          {code !== null && !validCode && (
            <Alert tone="error" title="That code does not look right">
              {parsedCode && !parsedCode.success ? parsedCode.error.issues[0]?.message : "Check the code on the board."}
            </Alert>
          )}
          <CodeBox initial={code ?? undefined} onCode={go} />
        </>
      ) : run.status === "pending" || run.status === "idle" ? (
        <p role="status">Looking for the class run…</p>
      ) : run.status === "failed" ? (
        <>
          <Alert tone="error" title="Class run not found">
            {run.message}
          </Alert>
          <CodeBox onCode={go} />
        </>
      ) : (
        <NicknameForm
          code={run.run.joinCode}
          title={run.run.classGroup ? `${run.run.title} · ${run.run.classGroup}` : run.run.title}
          onJoined={(joined) => {
            storePadSession(joined);
            setSession(joined);
          }}
        />
      )}
      <p className="text-sm text-ink-soft">
        <a href="/privacy" className="underline">
          How Outroll looks after your data
        </a>
      </p>
    </PadFrame>
  );
}
