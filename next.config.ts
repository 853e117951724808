import type { NextConfig } from "next";
import { API_CONTENT_SECURITY_POLICY, HSTS, STATIC_SECURITY_HEADERS } from "./lib/security-headers";

const staticHeaders = Object.entries(STATIC_SECURITY_HEADERS).map(([key, value]) => ({ key, value }));

const nextConfig: NextConfig = {
  // Native and file-reading packages stay outside the server bundle.
  serverExternalPackages: ["better-sqlite3", "pdfjs-dist", "@pdf-lib/fontkit", "smtp-server"],
  poweredByHeader: false,
  typedRoutes: false,
  // The proxy sets these (and the page CSP with its nonce); this covers what it does not see: static files and the upload route.
  async headers() {
    return [
      { source: "/:path*", headers: staticHeaders },
      { source: "/:path*", has: [{ type: "header", key: "x-forwarded-proto", value: "https" }], headers: [{ key: "Strict-Transport-Security", value: HSTS }] },
      { source: "/api/uploads", headers: [{ key: "Content-Security-Policy", value: API_CONTENT_SECURITY_POLICY }] },
    ];
  },
};

export default nextConfig;
