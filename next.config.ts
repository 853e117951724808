import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // Native and file-reading packages stay outside the server bundle.
  serverExternalPackages: ["better-sqlite3", "pdfjs-dist", "@pdf-lib/fontkit", "smtp-server"],
  poweredByHeader: false,
  typedRoutes: false,
};

export default nextConfig;
