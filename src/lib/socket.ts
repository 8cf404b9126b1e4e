import { io, type Socket } from "socket.io-client";

/**
 * A socket.io connection to this app's own server (same origin as the page). It reconnects by itself with a capped
 * back-off; every emit the features make waits for an acknowledgement with a timeout.
 */
export function openAppSocket(): Socket {
  return io({
    path: "/socket.io",
    reconnectionDelay: 500,
    reconnectionDelayMax: 4_000,
    randomizationFactor: 0.4,
    timeout: 10_000,
    ackTimeout: 8_000,
    withCredentials: true,
  });
}
