import client from "prom-client";

/** This process's Prometheus metrics, served at /metrics (prom-client's text format). */
export const metricsRegistry = new client.Registry();
client.collectDefaultMetrics({ register: metricsRegistry, prefix: "outroll_" });

export const rollsAcknowledged = new client.Counter({
  name: "outroll_rolls_acknowledged_total",
  help: "Rolls answered to a phone after their batch committed, by outcome (stored, duplicate).",
  labelNames: ["outcome"] as const,
  registers: [metricsRegistry],
});

export const rollAckSeconds = new client.Histogram({
  name: "outroll_roll_ack_seconds",
  help: "Time from a roll:record event arriving to its acknowledgement, in seconds.",
  buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5],
  registers: [metricsRegistry],
});

export const rollBatchFailures = new client.Counter({
  name: "outroll_roll_batch_failures_total",
  help: "Roll batches whose write failed (each is tried again once, then answered as retryable).",
  registers: [metricsRegistry],
});

export const connectedPhones = new client.Gauge({
  name: "outroll_connected_sockets",
  help: "socket.io connections open on this process (pupils' phones and Run boards).",
  registers: [metricsRegistry],
});

export const batcherQueueDepth = new client.Gauge({
  name: "outroll_roll_batcher_queue_depth",
  help: "Rolls waiting for the next batch, plus rolls in batches being written.",
  registers: [metricsRegistry],
});

export const databasePoolGauge = new client.Gauge({
  name: "outroll_database_pool_connections",
  help: "Database pool connections by state (total, idle, waiting requests).",
  labelNames: ["state"] as const,
  registers: [metricsRegistry],
});
