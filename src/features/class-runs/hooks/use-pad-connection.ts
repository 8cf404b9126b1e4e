import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useState, useSyncExternalStore } from "react";
import { PadConnection, padStateQueryKey, storedPadState, type PadSession, type PadSnapshot } from "../delivery/pad-connection";

const idle: PadSnapshot = { connected: false, waiting: 0, log: [], notice: null };
const noSubscription = () => () => undefined;

/** The phone's link to its group (socket, outbox, log) and the group's state from the server, kept live. */
export function usePadConnection(session: PadSession | null) {
  const queryClient = useQueryClient();
  const [connection, setConnection] = useState<PadConnection | null>(null);

  useEffect(() => {
    if (!session) return;
    const opened = new PadConnection(session, queryClient);
    setConnection(opened);
    return () => {
      opened.close();
      setConnection(null);
    };
    // A new token is a new group; the same token keeps the same connection.
  }, [session?.token, queryClient]);

  const snapshot = useSyncExternalStore(connection?.subscribe ?? noSubscription, connection?.getSnapshot ?? (() => idle));
  const groupId = session?.groupId ?? "none";
  const state = useQuery({
    queryKey: padStateQueryKey(groupId),
    queryFn: () => connection!.resume(),
    enabled: connection !== null,
    initialData: () => (session ? storedPadState(session.groupId) : undefined),
    initialDataUpdatedAt: 0,
    staleTime: 5_000,
    retry: 3,
    retryDelay: 1_500,
  });
  return { connection, snapshot, state };
}
