import type { NextConfig } from "next";
import { HSTS, STATIC_SECURITY_HEADERS } from "./lib/security-headers";

const staticHeaders = Object.entries(STATIC_SECURITY_HEADERS).map(([key, value]) => ({ key, value }));

const nextConfig: NextConfig = {
  // Native and file-reading packages stay outside the server bundle.
  serverExternalPackages: ["better-sqlite3", "pdfjs-dist", "@pdf-lib/fontkit", "smtp-server"],
  poweredByHeader: false,
  typedRoutes: false,
  // Every response, route handlers and static files included. The page CSP (with its nonce) comes from proxy.ts,
  // a route handler's from lib/http.ts: headers set here win over a route's own, so no CSP is set here.
  async headers() {
    return [
      { source: "/:path*", headers: staticHeaders },
      { source: "/:path*", has: [{ type: "header", key: "x-forwarded-proto", value: "https" }], headers: [{ key: "Strict-Transport-Security", value: HSTS }] },
    ];
  },
};

export default nextConfig;
