import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { decodeBoardUpdate, EVENTS, type BoardSnapshotAck, type BoardUpdateMessage } from "@shared/events";
import type { BoardSnapshot } from "@shared/schemas/class-runs";
import { openAppSocket } from "@/lib/socket";
import { runBoardQueryOptions } from "../api/get-run-board";

export type LiveState = "connecting" | "live" | "reconnecting";

/**
 * Keeps a Run board's query live: on every connect and reconnect it asks for a versioned snapshot read from the
 * database, then applies pushed updates only when their version is newer than what the cache holds.
 */
export function useLiveBoard(runId: string): { live: LiveState; problem: string | null } {
  const queryClient = useQueryClient();
  const [live, setLive] = useState<LiveState>("connecting");
  const [problem, setProblem] = useState<string | null>(null);

  useEffect(() => {
    const { queryKey } = runBoardQueryOptions(runId);
    const apply = (message: BoardUpdateMessage) => {
      const snapshot = decodeBoardUpdate(message);
      queryClient.setQueryData<BoardSnapshot>(queryKey, (current) => {
        if (current && current.version > snapshot.version) return current;
        // Pushed updates go to every watcher alike; who may manage the run comes from this teacher's own snapshot.
        return { ...snapshot, run: { ...snapshot.run, isOwner: current?.run.isOwner ?? snapshot.run.isOwner } };
      });
    };
    const socket = openAppSocket();
    socket.on("connect", async () => {
      try {
        const ack: BoardSnapshotAck = await socket.emitWithAck(EVENTS.boardSnapshot, { runId });
        if (ack.ok) {
          queryClient.setQueryData<BoardSnapshot>(queryKey, ack.snapshot);
          setProblem(null);
          setLive("live");
        } else {
          setProblem(ack.error.message);
        }
      } catch {
        setLive("reconnecting");
      }
    });
    socket.on("disconnect", () => setLive("reconnecting"));
    socket.on(EVENTS.boardUpdate, apply);
    return () => {
      socket.disconnect();
    };
  }, [queryClient, runId]);

  return { live, problem };
}
