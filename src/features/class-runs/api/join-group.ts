import { useMutation } from "@tanstack/react-query";
import { EVENTS, type GroupJoinAck } from "@shared/events";
import { openAppSocket } from "@/lib/socket";
import type { PadSession } from "../delivery/pad-connection";

/** A refusal from the server when joining, with its code (e.g. nickname_taken) and plain message. */
export class JoinRefusedError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = "JoinRefusedError";
  }
}

/** Joins a run with a new group nickname over socket.io and answers the session the phone keeps. */
export async function joinGroup({ code, nickname }: { code: string; nickname: string }): Promise<PadSession> {
  const socket = openAppSocket();
  try {
    const ack: GroupJoinAck = await socket.timeout(10_000).emitWithAck(EVENTS.groupJoin, { code, nickname });
    if (!ack.ok) throw new JoinRefusedError(ack.error.code, ack.error.message);
    return { token: ack.token, runId: ack.state.run.id, groupId: ack.state.group.id, nickname: ack.state.group.nickname, code };
  } catch (error) {
    if (error instanceof JoinRefusedError) throw error;
    throw new JoinRefusedError("offline", "The phone could not reach the class run. Check the Wi-Fi and try again.");
  } finally {
    socket.disconnect();
  }
}

export function useJoinGroup() {
  return useMutation({ mutationFn: joinGroup });
}
