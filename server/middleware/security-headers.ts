import helmet from "helmet";
import type { RequestHandler } from "express";

/**
 * Response headers on every answer — pages, API JSON, PDFs and CSVs (helmet). The policy allows only
 * what the built client uses: scripts, styles, fonts and workers from our origin (no inline script),
 * images from our origin plus `blob:` (Walk photos and plans kept on the device) and `data:`, API calls
 * to our origin. No framing (clickjacking), no MIME sniffing, no referrer beyond our origin.
 * `upgrade-insecure-requests` and HSTS only when the app is served over https.
 */
export function securityHeaders(options: { https: boolean }): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        "default-src": ["'self'"],
        "script-src": ["'self'"],
        "style-src": ["'self'"],
        "img-src": ["'self'", "blob:", "data:"],
        "font-src": ["'self'"],
        "connect-src": ["'self'"],
        "worker-src": ["'self'"],
        "manifest-src": ["'self'"],
        "object-src": ["'none'"],
        "base-uri": ["'self'"],
        "form-action": ["'self'"],
        "frame-ancestors": ["'none'"],
        ...(options.https ? { "upgrade-insecure-requests": [] } : {}),
      },
    },
    frameguard: { action: "deny" },
    referrerPolicy: { policy: "same-origin" },
    strictTransportSecurity: options.https ? { maxAge: 31_536_000 } : false,
    // Cross-origin isolation is not needed and would block nothing we serve; keep helmet's defaults otherwise.
  });
}
