import { connect } from "socket.io-client";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { EVENTS, RETRYABLE_ERROR_CODES, type GroupJoinAck } from "@shared/events";
import { paperImportColumns } from "@shared/schemas/paper-import";
import { db } from "../../server/db/client";
import { demoPassword, demoTeachers } from "../../seed/demo-scenario";
import { createLessonFor, openSocket, sessionCookie } from "../helpers/class-run-fixtures";
import { signUpAgent } from "../helpers/department-fixtures";
import { insertFixtureRun } from "../helpers/results-fixtures";
import { HttpAgent, startTestApp, type TestApp } from "../helpers/test-app";

let app: TestApp;
let tomaszAgent: HttpAgent;
let paperRun: string;
let joinCode: string;
let runId: string;
const tomasz = demoTeachers.find((t) => t.role === "teacher")!;
// Another port of the same machine: same site, another origin.
const otherOrigin = "http://127.0.0.1:1";

const diceSetInput = (name: string) => ({
  name,
  description: "Three dice for a starter.",
  visibility: "private",
  dice: [
    { name: "Fulmar", faces: [2, 2, 6, 6, 7, 7], colour: "teal", pattern: "dots" },
    { name: "Gannet", faces: [1, 5, 5, 5, 5, 9], colour: "amber", pattern: "stripes" },
    { name: "Skua", faces: [3, 3, 3, 4, 8, 8], colour: "plum", pattern: "checks" },
  ],
});

/** A socket.io handshake with chosen headers; answers "connected" or the refusal's message. */
function handshake(headers: Record<string, string>): Promise<string> {
  const socket = connect(app.baseUrl, {
    path: "/socket.io",
    transports: ["websocket"],
    forceNew: true,
    reconnection: false,
    extraHeaders: headers,
  });
  return new Promise((resolve) => {
    socket.once("connect", () => {
      socket.disconnect();
      resolve("connected");
    });
    socket.once("connect_error", (error) => {
      socket.disconnect();
      resolve(`refused: ${error.message}`);
    });
  });
}

function csvUpload(bytes: Uint8Array, name = "sheets.csv") {
  const form = new FormData();
  form.set("createGroups", "true");
  form.set("file", new Blob([new Uint8Array(bytes)], { type: "text/csv" }), name);
  return form;
}

const paperCsv = [paperImportColumns.join(","), "Puffins,1,Skua,10,Tern,9,,", "Puffins,2,Tern,11,Skua,12,,"].join("\r\n");

function utf16(text: string, order: "le" | "be", withBom: boolean): Uint8Array {
  const le = Buffer.from(text, "utf16le");
  const bytes = order === "le" ? le : Buffer.from(le).swap16();
  const bom = order === "le" ? [0xff, 0xfe] : [0xfe, 0xff];
  return withBom ? Buffer.concat([Buffer.from(bom), bytes]) : bytes;
}

beforeAll(async () => {
  app = await startTestApp();
  tomaszAgent = new HttpAgent(app.baseUrl);
  await tomaszAgent.signIn(tomasz.email, demoPassword);
  paperRun = (
    await insertFixtureRun(db, {
      ownerEmail: tomasz.email,
      title: `Q${crypto.randomUUID().slice(0, 6)} Paper run`,
      classGroup: "8K",
      groups: [],
    })
  ).runId;
  const lessonId = await createLessonFor(tomasz.email);
  const opened = await tomaszAgent.post("/api/class-runs", { lessonId });
  expect(opened.status).toBe(201);
  joinCode = opened.body.joinCode;
  runId = opened.body.id;
});
afterAll(() => app.close());

describe("requests from another origin", () => {
  it("refuses a state-changing request from another origin with a clear 403, by Origin or by Fetch Metadata", async () => {
    const byOrigin = await tomaszAgent.request("POST", "/api/dice-sets", diceSetInput("Cross-origin set"), { origin: otherOrigin });
    expect(byOrigin.status).toBe(403);
    expect(byOrigin.body.error.code).toBe("cross_origin");
    expect(byOrigin.body.error.message).toMatch(/Outroll's own pages/);
    // The probe's form: a text/plain POST, which a browser sends across origins without asking first.
    const plainText = await tomaszAgent.request("POST", "/api/dice-sets/import", JSON.stringify({ format: "outroll-dice-set" }), {
      origin: otherOrigin,
      "content-type": "text/plain",
    });
    expect(plainText.status).toBe(403);
    for (const site of ["same-site", "cross-site"]) {
      const byMetadata = await tomaszAgent.request("POST", "/api/dice-sets", diceSetInput("Fetch metadata set"), {
        "sec-fetch-site": site,
      });
      expect(byMetadata.status).toBe(403);
      expect(byMetadata.body.error.code).toBe("cross_origin");
    }
    const signIn = await new HttpAgent(app.baseUrl).request(
      "POST",
      "/api/auth/sign-in/email",
      { email: tomasz.email, password: demoPassword },
      { origin: otherOrigin },
    );
    expect(signIn.status).toBe(403);
    expect(signIn.body.error.code).toBe("cross_origin");
  });

  it("lets the app's own pages change things and anyone read", async () => {
    const own = await tomaszAgent.request("POST", "/api/dice-sets", diceSetInput("Same-origin set"), { "sec-fetch-site": "same-origin" });
    expect(own.status).toBe(201);
    const read = await tomaszAgent.request("GET", "/api/dice-sets", undefined, { origin: otherOrigin });
    expect(read.status).toBe(200);
  });

  it("refuses the socket handshake of a board or a phone from another origin and accepts the app's own", async () => {
    const cookie = await sessionCookie(app.baseUrl, tomasz.email, demoPassword);
    expect(await handshake({ cookie, origin: otherOrigin })).toMatch(/^refused/);
    expect(await handshake({ origin: otherOrigin })).toMatch(/^refused/);
    expect(await handshake({ cookie, origin: app.baseUrl })).toBe("connected");
    const board = await openSocket(app.baseUrl, cookie);
    const snapshot = await board.emitWithAck(EVENTS.boardSnapshot, { runId });
    expect(snapshot.ok).toBe(true);
    board.disconnect();
  });
});

describe("text the database cannot store", () => {
  it("answers 400 invalid_input, not 500, for a NUL character in a route's JSON, a query or a sign-up", async () => {
    const lone = await signUpAgent(app.baseUrl, "nul-department");
    const cases = [
      await lone.agent.post("/api/departments", { name: "Maths\u0000 department" }),
      await tomaszAgent.post("/api/dice-sets", diceSetInput("Null\u0000 set")),
      await tomaszAgent.post("/api/dice-sets/import", { ...diceSetInput("Import\u0000"), format: "outroll-dice-set", version: 1 }),
      await tomaszAgent.get("/api/results/runs?lesson=a%00b"),
      await new HttpAgent(app.baseUrl).post("/api/auth/sign-up/email", {
        name: "Nul\u0000 Teacher",
        email: `nul-${crypto.randomUUID().slice(0, 6)}@outroll-tests.test`,
        password: "tidal-pool-lantern-42",
      }),
    ];
    for (const response of cases) {
      expect(response.status, response.text).toBe(400);
      expect(response.body.error.code).toBe("invalid_input");
      expect(response.body.error.message).toMatch(/NUL/);
    }
  });

  it("answers a phone's NUL nickname with invalid_input, an error the phone does not retry", async () => {
    const phone = await openSocket(app.baseUrl);
    const ack: GroupJoinAck = await phone.emitWithAck(EVENTS.groupJoin, { code: joinCode, nickname: "Puf\u0000fins" });
    phone.disconnect();
    expect(ack.ok).toBe(false);
    if (ack.ok) return;
    expect(ack.error.code).toBe("invalid_input");
    expect(RETRYABLE_ERROR_CODES).not.toContain(ack.error.code);
  });
});

describe("uploads", () => {
  it("answers a multipart upload cut off half-way with 400 invalid_input", async () => {
    const boundary = "----outroll-cut-off";
    const body = `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="sheets.csv"\r\nContent-Type: text/csv\r\n\r\ngroup,roll,die_1`;
    const response = await tomaszAgent.request("POST", `/api/results/runs/${paperRun}/paper-import/preview`, body, {
      "content-type": `multipart/form-data; boundary=${boundary}`,
    });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_input");
    expect(response.body.error.message).toMatch(/cut off/);
    const lessonId = await createLessonFor(tomasz.email);
    const attachment = await tomaszAgent.request(
      "POST",
      `/api/lessons/${lessonId}/attachments`,
      body.replace("sheets.csv", "worksheet.pdf"),
      {
        "content-type": `multipart/form-data; boundary=${boundary}`,
      },
    );
    expect(attachment.status).toBe(400);
    expect(attachment.body.error.code).toBe("invalid_input");
  });

  it("reads Paper import files saved as UTF-16 (either byte order, with or without a byte order mark) and as UTF-8 with a byte order mark", async () => {
    const files = [
      utf16(paperCsv, "le", true),
      utf16(paperCsv, "be", true),
      utf16(paperCsv, "le", false),
      Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(paperCsv, "utf8")]),
    ];
    for (const bytes of files) {
      const response = await tomaszAgent.postForm(`/api/results/runs/${paperRun}/paper-import/preview`, csvUpload(bytes));
      expect(response.status, response.text).toBe(200);
      expect(response.body.errors).toEqual([]);
      expect(response.body.rows.map((row: { group: string; rollNumber: number }) => `${row.group} ${row.rollNumber}`)).toEqual([
        "Puffins 1",
        "Puffins 2",
      ]);
    }
  });

  it("answers a file in another encoding, or with NUL bytes, with 400 invalid_input and what to do", async () => {
    const latin1 = Buffer.from(`${paperCsv}\r\nMou\u00e9ttes,1,Skua,10,Tern,9,,`, "latin1");
    const withNul = Buffer.from(`${paperCsv}\r\nPuf\u0000fins,3,Skua,10,Tern,9,,`, "utf8");
    for (const bytes of [latin1, withNul]) {
      const response = await tomaszAgent.postForm(`/api/results/runs/${paperRun}/paper-import/preview`, csvUpload(bytes));
      expect(response.status).toBe(400);
      expect(response.body.error.code).toBe("invalid_input");
      expect(response.body.error.message).toMatch(/CSV UTF-8/);
    }
  });
});
