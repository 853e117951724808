import { afterAll, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { equipmentLibrary, projects } from "../../db/schema";
import type { ServiceContext } from "../../lib/services/context";
import { makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

/**
 * The wrappers every route handler and server action goes through: what each
 * refuses, with which message, and that a refused request reaches no service
 * and changes no row.
 */

let acting: ServiceContext | null = null;
let requestHeaders = new Headers();
vi.mock("server-only", () => ({}));
vi.mock("@/lib/auth/session", () => ({
  requireContext: async (options: { passwordChange?: boolean } = {}) => {
    if (!acting) {
      const { unauthenticated } = await import("../../lib/services/errors");
      throw unauthenticated();
    }
    if (acting.mustChangePassword && !options.passwordChange) {
      const { ServiceError } = await import("../../lib/services/errors");
      throw new ServiceError("forbidden", "Choose your own password first.");
    }
    return acting;
  },
}));
vi.mock("next/headers", () => ({ headers: async () => requestHeaders }));
vi.mock("next/navigation", () => ({ unstable_rethrow: () => undefined }));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));
process.env.APP_URL = "http://localhost:3000";

const { defineRoute } = await import("../../lib/http");
const { defineAction } = await import("../../lib/auth/action");
const projectsRoute = await import("../../app/api/projects/route");
const libraryRoute = await import("../../app/api/library/route");

const t = tempDatabase();
afterAll(() => t.cleanup());
const org = makeOrg(t.db);
const designer = makeContext(t.db, org.id, ["designer"]);
const installer = makeContext(t.db, org.id, ["installer"]);
const jurisdiction = makeJurisdiction(t.db, org.id);
const rows = () => t.db.select().from(projects).all().length + t.db.select().from(equipmentLibrary).all().length;

function post(url: string, body: string, headers: Record<string, string> = { "content-type": "application/json" }) {
  return new Request(`http://localhost:3000${url}`, { method: "POST", body, headers });
}

describe("defineRoute", () => {
  let runs = 0;
  const probe = defineRoute({
    access: "user",
    permission: "project:create",
    json: z.object({ name: z.string().max(10) }),
    maxBytes: 1024,
    run: ({ body }) => {
      runs += 1;
      return Response.json({ got: body.name });
    },
  });

  it("lets a good request through to run, with the parsed body and the API headers", async () => {
    acting = designer;
    const response = await probe(post("/x", JSON.stringify({ name: "ok" })));
    expect(response.status).toBe(200);
    expect(await response.json()).toEqual({ got: "ok" });
    // The API's own CSP (lib/security-headers.ts): a JSON answer may load and run nothing.
    expect(response.headers.get("content-security-policy")).toContain("default-src 'none'");
    expect(runs).toBe(1);
  });

  it.each([
    ["signed out", null, post("/x", JSON.stringify({ name: "ok" })), 401],
    ["a role without the permission", "installer", post("/x", JSON.stringify({ name: "ok" })), 403],
    ["another site's page", "designer", post("/x", JSON.stringify({ name: "ok" }), { "content-type": "application/json", origin: "https://elsewhere.example" }), 403],
    ["a text/plain form post", "designer", post("/x", JSON.stringify({ name: "ok" }), { "content-type": "text/plain" }), 415],
    ["malformed JSON", "designer", post("/x", "{name:"), 400],
    ["a field past its bound", "designer", post("/x", JSON.stringify({ name: "x".repeat(11) })), 400],
    ["a body past the byte bound", "designer", post("/x", JSON.stringify({ name: "ok", pad: "x".repeat(2000) })), 413],
  ] as const)("refuses %s before run (status %i)", async (_what, who, request, status) => {
    acting = who === null ? null : who === "installer" ? installer : designer;
    const before = runs;
    const response = await probe(request);
    expect(response.status).toBe(status);
    const body = (await response.json()) as { error: string };
    expect(body.error.length).toBeGreaterThan(10);
    expect(runs).toBe(before);
  });

  it("maps an error thrown below to a JSON answer with no stack", async () => {
    const broken = defineRoute({
      access: "public",
      run: () => {
        throw new Error("secret internals at /srv/app/lib/x.ts:12");
      },
    });
    const spy = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const response = await broken(new Request("http://localhost:3000/y"));
    spy.mockRestore();
    expect(response.status).toBe(500);
    expect(await response.text()).not.toContain("secret internals");
  });
});

describe("the real routes refuse bad input by name and change nothing", () => {
  it("a project that is not a JSON object", async () => {
    acting = designer;
    const before = rows();
    const response = await projectsRoute.POST(post("/api/projects", JSON.stringify(["not", "an", "object"])), { params: Promise.resolve({}) });
    expect(response.status).toBe(400);
    expect(((await response.json()) as { issues: { message: string }[] }).issues[0]!.message).toContain("JSON object");
    expect(rows()).toBe(before);
  });

  it("a library item from a role that may not edit the library, however large, is refused before it is read", async () => {
    acting = installer;
    const before = rows();
    const response = await libraryRoute.POST(post("/api/library", JSON.stringify({ kind: "module", pad: "x".repeat(100_000) })), { params: Promise.resolve({}) });
    expect(response.status).toBe(403);
    expect(rows()).toBe(before);
  });

  it("a project with a missing field names it", async () => {
    acting = designer;
    const before = rows();
    const response = await projectsRoute.POST(post("/api/projects", JSON.stringify({ name: "Half a project", jurisdictionId: jurisdiction.id })), { params: Promise.resolve({}) });
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: string; issues: { path: string }[] };
    expect(body.issues.length).toBeGreaterThan(0);
    expect(rows()).toBe(before);
  });
});

describe("defineAction", () => {
  let runs = 0;
  const probe = defineAction({
    access: "user",
    permission: "project:create",
    read: (input: unknown) => input,
    schema: z.object({ name: z.string().min(1, { message: "is required" }).max(10) }),
    invalidMessage: "Nothing was saved: some fields are not valid.",
    run: (_ctx, input) => {
      runs += 1;
      return input.name;
    },
    message: "Saved.",
  });

  it("runs a good call and reports its message", async () => {
    acting = designer;
    requestHeaders = new Headers({ origin: "http://localhost:3000", host: "localhost:3000" });
    expect(await probe({ name: "ok" })).toEqual({ ok: true, data: "ok", message: "Saved." });
  });

  it("refuses, by name, a field that is missing or of the wrong type, without running", async () => {
    acting = designer;
    const before = runs;
    const result = await probe({ name: 42 });
    expect(result).toMatchObject({ ok: false, code: "invalid", error: "Nothing was saved: some fields are not valid.", issues: [{ path: "name" }] });
    expect(runs).toBe(before);
  });

  it("refuses a call posted from another site, signed out, or by a role without the permission", async () => {
    const before = runs;
    acting = designer;
    requestHeaders = new Headers({ origin: "https://elsewhere.example", host: "localhost:3000" });
    expect(await probe({ name: "ok" })).toMatchObject({ ok: false, code: "forbidden" });
    requestHeaders = new Headers({ origin: "http://localhost:3000", host: "localhost:3000" });
    acting = null;
    expect(await probe({ name: "ok" })).toMatchObject({ ok: false, code: "unauthenticated" });
    acting = installer;
    expect(await probe({ name: "ok" })).toMatchObject({ ok: false, code: "forbidden" });
    expect(runs).toBe(before);
  });

  it("keeps a person holding an admin-set password out of everything but the password change", async () => {
    requestHeaders = new Headers();
    acting = { ...designer, mustChangePassword: true };
    expect(await probe({ name: "ok" })).toMatchObject({ ok: false, code: "forbidden" });
    const change = defineAction({ access: "password-change", read: () => ({}), schema: z.object({}), run: () => "changed" });
    expect(await change()).toMatchObject({ ok: true, data: "changed" });
  });

  it("maps an unexpected error to a plain message", async () => {
    acting = designer;
    const broken = defineAction({
      access: "user",
      read: () => ({}),
      schema: z.object({}),
      run: () => {
        throw new Error("secret internals");
      },
    });
    const spy = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const result = await broken();
    spy.mockRestore();
    expect(result).toMatchObject({ ok: false, code: "internal" });
    expect(JSON.stringify(result)).not.toContain("secret internals");
  });
});
