import { useEffect, useState } from "react";
import QRCode from "qrcode";
import type { ClassRun } from "@shared/schemas/class-runs";

/** The address phones open: the server's APP_ORIGIN when it was given one, else the address this browser used. */
export function joinUrlOf(run: Pick<ClassRun, "joinPath" | "configuredOrigin">): string {
  return `${run.configuredOrigin ?? window.location.origin}${run.joinPath}`;
}

/** True when phones cannot reach the join address (it names this computer only). */
export function isLoopbackAddress(url: string): boolean {
  const host = new URL(url).hostname;
  return host === "localhost" || host === "::1" || host === "[::1]" || host.startsWith("127.");
}

/** A QR code of `text` as a PNG data URL, drawn by the qrcode package (error correction M, wide quiet zone). */
export function useQrCode(text: string, width = 480): string | null {
  const [dataUrl, setDataUrl] = useState<string | null>(null);
  useEffect(() => {
    let current = true;
    QRCode.toDataURL(text, { errorCorrectionLevel: "M", margin: 3, width, color: { dark: "#000000", light: "#ffffff" } }).then(
      (url) => current && setDataUrl(url),
      () => current && setDataUrl(null),
    );
    return () => {
      current = false;
    };
  }, [text, width]);
  return dataUrl;
}
