import { describe, expect, it } from "vitest";
import type { RollPayload, RollRecordAck, RollUndoAck } from "@shared/events";
import {
  keyValueOutboxStore,
  recordOperation,
  RollOutbox,
  undoOperation,
  type OutboxTransport,
} from "@/features/class-runs/delivery/roll-outbox";

type Call = { kind: "record" | "undo"; id: string; settle: (answer: RollRecordAck | RollUndoAck | Error) => void };

/** A transport whose answers the test gives by hand, so the order of sends can be checked. */
function manualTransport() {
  const calls: Call[] = [];
  let connected = true;
  const transport: OutboxTransport = {
    isConnected: () => connected,
    record: (roll) =>
      new Promise((resolve, reject) =>
        calls.push({
          kind: "record",
          id: roll.id,
          settle: (answer) => (answer instanceof Error ? reject(answer) : resolve(answer as RollRecordAck)),
        }),
      ),
    undo: (rollId) =>
      new Promise((resolve, reject) =>
        calls.push({
          kind: "undo",
          id: rollId,
          settle: (answer) => (answer instanceof Error ? reject(answer) : resolve(answer as RollUndoAck)),
        }),
      ),
  };
  return { transport, calls, setConnected: (value: boolean) => (connected = value) };
}

function memoryStore() {
  const memory = new Map<string, string>();
  return keyValueOutboxStore({ getItem: (key) => memory.get(key) ?? null, setItem: (key, value) => void memory.set(key, value) }, "outbox");
}

const roll = (id: string): RollPayload => ({ id, tally: 1, matchup: [0, 1], faces: [[1], [2]], recordedAt: "2026-03-10T09:00:00.000Z" });
const tick = () => new Promise((resolve) => setTimeout(resolve, 0));

describe("RollOutbox", () => {
  it("keeps a roll until it is acknowledged and sends several at once", async () => {
    const { transport, calls } = manualTransport();
    const outbox = new RollOutbox(memoryStore(), transport, { maxInFlight: 2 });
    outbox.add(recordOperation(roll("a")));
    outbox.add(recordOperation(roll("b")));
    outbox.add(recordOperation(roll("c")));
    expect(calls.map((call) => call.id)).toEqual(["a", "b"]);
    calls[0].settle({ ok: true, id: "a", duplicate: false });
    await tick();
    expect(outbox.pending().map((entry) => entry.key)).toEqual(["b", "c"]);
    expect(calls.map((call) => call.id)).toEqual(["a", "b", "c"]);
  });

  it("keeps a roll whose answer never came and sends it again on the next flush", async () => {
    const { transport, calls, setConnected } = manualTransport();
    const outbox = new RollOutbox(memoryStore(), transport, { retryDelayMs: 60_000 });
    outbox.add(recordOperation(roll("a")));
    setConnected(false);
    calls[0].settle(new Error("timeout"));
    await tick();
    expect(outbox.pending()).toHaveLength(1);
    outbox.add(recordOperation(roll("b")));
    expect(calls).toHaveLength(1);
    setConnected(true);
    outbox.flush();
    expect(calls.map((call) => call.id)).toEqual(["a", "a", "b"]);
    calls[1].settle({ ok: true, id: "a", duplicate: true });
    calls[2].settle({ ok: true, id: "b", duplicate: false });
    await tick();
    expect(outbox.pending()).toEqual([]);
    outbox.stop();
  });

  it("sends an undo only after everything before it, and nothing after it before it", async () => {
    const { transport, calls } = manualTransport();
    const outbox = new RollOutbox(memoryStore(), transport);
    outbox.add(recordOperation(roll("a")));
    outbox.add(undoOperation("a"));
    outbox.add(recordOperation(roll("b")));
    expect(calls.map((call) => `${call.kind}:${call.id}`)).toEqual(["record:a"]);
    calls[0].settle({ ok: true, id: "a", duplicate: false });
    await tick();
    expect(calls.map((call) => `${call.kind}:${call.id}`)).toEqual(["record:a", "undo:a"]);
    calls[1].settle({ ok: true, id: "a" });
    await tick();
    expect(calls.map((call) => `${call.kind}:${call.id}`)).toEqual(["record:a", "undo:a", "record:b"]);
  });

  it("drops a roll refused for good, telling why, and keeps one refused for now (paused) for later", async () => {
    const { transport, calls } = manualTransport();
    const outbox = new RollOutbox(memoryStore(), transport, { retryDelayMs: 60_000 });
    const events: string[] = [];
    outbox.subscribe((event) => events.push(event.type === "refused" ? `refused:${event.error.code}` : event.type));
    outbox.add(recordOperation(roll("bad")));
    outbox.add(recordOperation(roll("later")));
    calls[0].settle({ ok: false, error: { code: "bad_faces", message: "3 is not a face of Auk." } });
    calls[1].settle({ ok: false, error: { code: "run_paused", message: "Paused.", retryAfterMs: 60_000 } });
    await tick();
    expect(events).toContain("refused:bad_faces");
    expect(outbox.pending().map((entry) => entry.key)).toEqual(["later"]);
    outbox.stop();
  });

  it("takes back a roll that has not left the phone, but not one on its way", () => {
    const { transport, setConnected } = manualTransport();
    const outbox = new RollOutbox(memoryStore(), transport);
    setConnected(false);
    outbox.add(recordOperation(roll("queued")));
    expect(outbox.withdrawRecord("queued")).toBe(true);
    expect(outbox.pending()).toEqual([]);
    setConnected(true);
    outbox.add(recordOperation(roll("sent")));
    expect(outbox.withdrawRecord("sent")).toBe(false);
  });

  it("survives a reload: a new outbox on the same storage finds what was kept", () => {
    const memory = new Map<string, string>();
    const storage = {
      getItem: (key: string) => memory.get(key) ?? null,
      setItem: (key: string, value: string) => void memory.set(key, value),
    };
    const offline = manualTransport();
    offline.setConnected(false);
    new RollOutbox(keyValueOutboxStore(storage, "k"), offline.transport).add(recordOperation(roll("kept")));
    const after = manualTransport();
    const reloaded = new RollOutbox(keyValueOutboxStore(storage, "k"), after.transport);
    reloaded.flush();
    expect(after.calls.map((call) => call.id)).toEqual(["kept"]);
  });

  it("keeps a roll refused with not_roll_phase, says why as a wait, and sends it again later", async () => {
    const { transport, calls } = manualTransport();
    const outbox = new RollOutbox(memoryStore(), transport, { retryDelayMs: 20 });
    const events: string[] = [];
    outbox.subscribe((event) => events.push(event.type === "waiting" ? `waiting:${event.code}` : event.type));
    outbox.add(recordOperation(roll("a")));
    calls[0].settle({ ok: false, error: { code: "not_roll_phase", message: "The class is not rolling now." } });
    await tick();
    expect(outbox.pending().map((entry) => entry.key)).toEqual(["a"]);
    expect(events).toContain("waiting:not_roll_phase");
    expect(events).not.toContain("refused");
    await new Promise((resolve) => setTimeout(resolve, 40));
    expect(calls.map((call) => call.id)).toEqual(["a", "a"]);
    calls[1].settle({ ok: true, id: "a", duplicate: false });
    await tick();
    expect(outbox.pending()).toEqual([]);
    outbox.stop();
  });

  it("drops a roll refused with group_removed, reporting it as refused for good", async () => {
    const { transport, calls } = manualTransport();
    const outbox = new RollOutbox(memoryStore(), transport);
    const refused: string[] = [];
    outbox.subscribe((event) => event.type === "refused" && refused.push(event.error.code));
    outbox.add(recordOperation(roll("a")));
    calls[0].settle({ ok: false, error: { code: "group_removed", message: "Your teacher removed this group." } });
    await tick();
    expect(outbox.pending()).toEqual([]);
    expect(refused).toEqual(["group_removed"]);
    outbox.stop();
  });
});
