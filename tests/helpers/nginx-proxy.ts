// Debian's nginx on loopback in front of app processes, as deploy/nginx/ runs it; no server code is imported here, so
// the load bench can use it before it sets its own DATABASE_URL.
import { spawn } from "node:child_process";
import { chmodSync, existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";

export function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = createServer().listen(0, "127.0.0.1", () => {
      const address = probe.address();
      probe.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

export const sleep = (milliseconds: number) => new Promise((resolve) => setTimeout(resolve, milliseconds));

/**
 * nginx in front of the given app ports, as deploy/nginx/outroll.conf (without TLS): WebSocket upgrade, round robin,
 * and a process that refuses connections three times is skipped for the next two seconds. Start it once the app
 * processes are ready, or its first probes mark them down.
 */
export async function startNginx(
  folder: string,
  appPorts: number[],
  listenPort?: number,
): Promise<{ url: string; stop: () => Promise<void> }> {
  const binary = ["/usr/sbin/nginx", "/usr/bin/nginx"].find((candidate) => existsSync(candidate)) ?? "nginx";
  const port = listenPort ?? (await freePort());
  const prefix = path.join(folder, "nginx");
  mkdirSync(path.join(prefix, "logs"), { recursive: true });
  const config = path.join(prefix, "nginx.conf");
  writeFileSync(
    config,
    `daemon off;
worker_processes 1;
pid ${prefix}/nginx.pid;
error_log ${prefix}/logs/error.log warn;
events { worker_connections 1024; }
http {
  access_log off;
  client_body_temp_path ${prefix}/body;
  proxy_temp_path ${prefix}/proxy;
  fastcgi_temp_path ${prefix}/fastcgi;
  uwsgi_temp_path ${prefix}/uwsgi;
  scgi_temp_path ${prefix}/scgi;
  map $http_upgrade $connection_upgrade { default upgrade; '' close; }
  upstream outroll {
${appPorts.map((appPort) => `    server 127.0.0.1:${appPort} max_fails=3 fail_timeout=2s;`).join("\n")}
  }
  server {
    listen 127.0.0.1:${port};
    location / {
      proxy_pass http://outroll;
      proxy_http_version 1.1;
      proxy_set_header Upgrade $http_upgrade;
      proxy_set_header Connection $connection_upgrade;
      proxy_set_header Host $host;
      proxy_set_header X-Forwarded-For $proxy_add_x_forwarded_for;
      proxy_set_header X-Forwarded-Proto $scheme;
      proxy_read_timeout 120s;
      proxy_next_upstream error timeout http_502 http_503;
      proxy_connect_timeout 5s;
    }
  }
}
`,
  );
  const child = spawn(binary, ["-c", config, "-p", prefix], { stdio: ["ignore", "ignore", "inherit"] });
  // If the caller dies half-way (a failed bench), nginx goes with it rather than holding its port.
  const stopWithCaller = () => child.kill("SIGQUIT");
  process.once("exit", stopWithCaller);
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 15_000;
  for (;;) {
    try {
      await fetch(`${url}/api/health`);
      break;
    } catch {
      if (Date.now() > deadline) throw new Error("nginx did not start within 15 s");
      await sleep(100);
    }
  }
  return {
    url,
    stop: async () => {
      process.off("exit", stopWithCaller);
      if (child.exitCode !== null) return;
      const exited = new Promise((resolve) => child.once("exit", resolve));
      child.kill("SIGQUIT");
      await exited;
    },
  };
}

/** A scratch folder the postgres user can reach (the tests may run as root from a private clone). */
export function scratchFolder(label: string): { path: string; remove: () => void } {
  const folder = mkdtempSync(`/tmp/outroll-${label}-`);
  chmodSync(folder, 0o755);
  return { path: folder, remove: () => rmSync(folder, { recursive: true, force: true }) };
}
