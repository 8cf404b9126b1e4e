/**
 * Registers the pad's service worker (built by vite-plugin-pwa as /pad-sw.js) for /pad only, so it keeps the pad's
 * shell for a reload without network and never serves the teachers' pages. Browsers allow service workers on HTTPS
 * and on localhost only; on plain http the pad works as before, online. workbox-window loads after the page, off the
 * path to the nickname field.
 */
export function registerPadServiceWorker() {
  if (!import.meta.env.PROD || !("serviceWorker" in navigator) || !window.isSecureContext) return;
  const register = () =>
    void import("workbox-window").then(({ Workbox }) => new Workbox("/pad-sw.js", { scope: "/pad" }).register()).catch(() => undefined);
  if (document.readyState === "complete") register();
  else window.addEventListener("load", register, { once: true });
}
