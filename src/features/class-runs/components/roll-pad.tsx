import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { useNavigate } from "react-router-dom";
import { z } from "zod";
import { joinCodeSchema, nicknameSchema, NICKNAME_MAX } from "@shared/schemas/class-runs";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { ApiRequestError } from "@/lib/api-client";
import { usePadRun } from "../api/get-pad-run";
import { useJoinGroup } from "../api/join-group";
import { storedPadSession, storePadSession, type PadSession } from "../delivery/pad-connection";
import { GroupPad } from "./group-pad";
import { PadFrame } from "./pad-frame";

const codeFormSchema = z.object({ code: joinCodeSchema });
const nicknameFormSchema = z.object({ nickname: nicknameSchema });

function CodeBox({ initial }: { initial?: string }) {
  const navigate = useNavigate();
  const { register, handleSubmit, formState } = useForm<z.input<typeof codeFormSchema>, unknown, z.output<typeof codeFormSchema>>({
    resolver: zodResolver(codeFormSchema),
    defaultValues: { code: initial ?? "" },
  });
  return (
    <form noValidate onSubmit={handleSubmit(({ code }) => navigate(`/pad/${code}`))} className="flex flex-col gap-4" aria-label="Find a class run by its code">
      <TextField
        label="Join code"
        hint="Six letters and numbers, shown on the board at the front."
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
        inputMode="text"
        className="[&_input]:min-h-14 [&_input]:text-center [&_input]:font-mono [&_input]:text-3xl [&_input]:tracking-[0.3em] [&_input]:uppercase"
        {...register("code")}
        error={formState.errors.code?.message}
      />
      <Button type="submit" className="min-h-14 text-xl">
        Find the class run
      </Button>
    </form>
  );
}

function NicknameForm({ code, title, onJoined }: { code: string; title: string; onJoined: (session: PadSession) => void }) {
  const join = useJoinGroup();
  const { register, handleSubmit, formState, setError } = useForm<z.input<typeof nicknameFormSchema>, unknown, z.output<typeof nicknameFormSchema>>({
    resolver: zodResolver(nicknameFormSchema),
  });
  const submit = handleSubmit(({ nickname }) =>
    join.mutate(
      { code, nickname },
      {
        onSuccess: onJoined,
        onError: (error) => {
          if ("code" in error && (error.code === "nickname_taken" || error.code === "invalid_input")) setError("nickname", { message: error.message });
        },
      },
    ),
  );
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
        {...register("nickname")}
        error={formState.errors.nickname?.message}
      />
      {join.error && !formState.errors.nickname && (
        <Alert tone="error" title="Not joined yet">
          {join.error.message}
        </Alert>
      )}
      <Button type="submit" busy={join.isPending} className="min-h-14 text-xl">
        Join with this nickname
      </Button>
    </form>
  );
}

/**
 * The Roll pad: type or scan the join code, choose a nickname, then vote and record rolls. The group's token is kept
 * in this phone's storage, so a reload or a dropped connection comes back to the same group.
 */
export function RollPad({ code }: { code: string | null }) {
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
        session={session}
        onLeave={() => {
          storePadSession(null);
          setSession(null);
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
          <CodeBox initial={code ?? undefined} />
        </>
      ) : run.isPending ? (
        <p role="status">Looking for the class run…</p>
      ) : run.isError ? (
        <>
          <Alert tone="error" title="Class run not found">
            {run.error instanceof ApiRequestError ? run.error.message : "The class run could not be reached."}
          </Alert>
          <CodeBox />
        </>
      ) : (
        <NicknameForm
          code={run.data.joinCode}
          title={run.data.classGroup ? `${run.data.title} · ${run.data.classGroup}` : run.data.title}
          onJoined={(joined) => {
            storePadSession(joined);
            setSession(joined);
          }}
        />
      )}
    </PadFrame>
  );
}
