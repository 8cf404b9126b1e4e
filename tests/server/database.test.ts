import pg from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import { db, pool } from "../../server/db/client";
import { runMigrations } from "../../server/db/migrate";
import { member, organization, user } from "../../server/db/schema/index";
import { demoDepartment, demoTeachers } from "../../seed/demo-scenario";
import { seedDemoData } from "../../seed/seed-demo-data";
import { startTestApp } from "../helpers/test-app";

afterAll(() => pool.end());

describe("migrations", () => {
  it("apply to an empty database and create every table", async () => {
    const name = `outroll_empty_${Date.now()}`;
    const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await admin.connect();
    await admin.query(`create database ${name}`);
    const fresh = new pg.Pool({ connectionString: process.env.DATABASE_URL!.replace(/\/[^/]+$/, `/${name}`) });
    try {
      await runMigrations(fresh);
      await runMigrations(fresh);
      const tables = await fresh.query("select table_name from information_schema.tables where table_schema = 'public'");
      const names = tables.rows.map((row) => row.table_name);
      for (const table of ["user", "session", "account", "verification", "organization", "member", "invitation"]) {
        expect(names).toContain(table);
      }
    } finally {
      await fresh.end();
      await admin.query(`drop database ${name}`);
      await admin.end();
    }
  });
});

describe("demo data", () => {
  it("is idempotent: seeding again neither fails nor duplicates", async () => {
    const countAll = async () => ({
      users: (await db.select({ n: count() }).from(user))[0].n,
      departments: (await db.select({ n: count() }).from(organization).where(eq(organization.slug, demoDepartment.slug)))[0].n,
      members: (await db.select({ n: count() }).from(member))[0].n,
    });
    await seedDemoData(db);
    const before = await countAll();
    await seedDemoData(db);
    await seedDemoData(db);
    expect(await countAll()).toEqual(before);
    expect(before.departments).toBe(1);
  });

  it("holds one head and two teachers in the demo department", async () => {
    const rows = await db
      .select({ email: user.email, role: member.role })
      .from(member)
      .innerJoin(user, eq(member.userId, user.id))
      .innerJoin(organization, eq(member.organizationId, organization.id))
      .where(eq(organization.slug, demoDepartment.slug));
    expect(rows.map((r) => `${r.email}:${r.role}`).sort()).toEqual(demoTeachers.map((t) => `${t.email}:${t.role}`).sort());
  });
});

describe("health and readiness", () => {
  it("answers liveness without the database and readiness with the database up and every migration applied", async () => {
    const app = await startTestApp();
    try {
      const health = await fetch(`${app.baseUrl}/api/health`);
      expect(await health.json()).toEqual({ ok: true });
      const ready = await fetch(`${app.baseUrl}/api/ready`);
      expect(ready.status).toBe(200);
      expect(await ready.json()).toEqual({ ok: true, db: "up", migrations: "applied", draining: false });
    } finally {
      await app.close();
    }
  });

  it("serves Prometheus metrics with the roll, socket and pool figures", async () => {
    const app = await startTestApp();
    try {
      const text = await (await fetch(`${app.baseUrl}/metrics`)).text();
      for (const name of [
        "outroll_rolls_acknowledged_total",
        "outroll_roll_ack_seconds_bucket",
        "outroll_connected_sockets",
        "outroll_roll_batcher_queue_depth",
        "outroll_database_pool_connections",
      ]) {
        expect(text).toContain(name);
      }
    } finally {
      await app.close();
    }
  });
});
