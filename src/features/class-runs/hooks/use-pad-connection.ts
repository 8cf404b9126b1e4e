import { useEffect, useRef, useState, useSyncExternalStore } from "react";
import {
  openPadConnection,
  storedPadState,
  storedWaitingCount,
  type PadConnection,
  type PadSession,
  type PadSnapshot,
} from "../delivery/pad-connection";

const noSubscription = () => () => undefined;

/** The phone's link to its group (socket, outbox, log) and the group's state, kept live by server events. */
export function usePadConnection(session: PadSession) {
  const [connection, setConnection] = useState<PadConnection | null>(null);
  // Before the connection opens (the first paint after a reload, perhaps offline), show what the phone kept.
  const [kept] = useState<PadSnapshot>(() => ({
    connected: false,
    waiting: storedWaitingCount(session.groupId),
    log: [],
    notice: null,
    state: storedPadState(session.groupId),
    problem: null,
    removed: false,
  }));

  // The connection is opened for a token; the session it was opened with is read through a ref, the latest one.
  const latestSession = useRef(session);
  useEffect(() => {
    latestSession.current = session;
  });

  useEffect(() => {
    let opened: PadConnection | null = null;
    let gone = false;
    void openPadConnection(latestSession.current).then((connection) => {
      if (gone) connection.close();
      else {
        opened = connection;
        setConnection(connection);
      }
    });
    return () => {
      gone = true;
      opened?.close();
      setConnection(null);
    };
    // A new token is a new group; the same token keeps the same connection.
  }, [session.token]);

  const snapshot = useSyncExternalStore(connection?.subscribe ?? noSubscription, connection?.getSnapshot ?? (() => kept));
  return { connection, snapshot };
}
