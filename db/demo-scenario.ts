/**
 * The demo scenario: an invented design-and-install firm, its people and the
 * jurisdictions it works in. Every name here is invented.
 */
import type { Role } from "../lib/auth/roles";

export const DEMO_ORG = {
  name: "Quillfeather Solar Co.",
  slug: "quillfeather",
  licenceNumber: "EC-208417",
  licenceClassification: "Electrical contractor",
  licenceState: "Alder Bay",
  phone: "555-0147",
  email: "permits@quillfeather.test",
  address: "12 Ropewalk Row, Alder Bay",
};

export const DEMO_USERS: { name: string; email: string; password: string; roles: Role[] }[] = [
  { name: "Dana Whitlock", email: "designer@quillfeather.test", password: "demo-designer-2026", roles: ["designer"] },
  { name: "Ines Marchetti, PE", email: "reviewer@quillfeather.test", password: "demo-reviewer-2026", roles: ["reviewer"] },
  { name: "Theo Brannigan", email: "office@quillfeather.test", password: "demo-office-2026", roles: ["office"] },
  { name: "Maya Ferreira-Holt", email: "installer@quillfeather.test", password: "demo-installer-2026", roles: ["installer"] },
  { name: "Sam Okafor", email: "admin@quillfeather.test", password: "demo-admin-2026", roles: ["admin"] },
];

export const DEMO_LICENCE = {
  email: "reviewer@quillfeather.test",
  licenceNumber: "PE-E-048213",
  region: "Westmark",
  discipline: "Electrical",
  expiresOn: "2028-06-30",
};

export const DEMO_JURISDICTIONS = [
  {
    name: "Alder Bay County",
    region: "Westmark",
    necEdition: "2017" as const,
    residentialCode: "none" as const,
    voltageDropLimitPct: 3,
    amendments:
      "Building department wants the battery disconnect within sight of the battery bank, labelled on the one-line. Generator inlet location shown on the site plan.",
    submissionMethod: "counter" as const,
    contact: { name: "Permit counter, County Building Division", phone: "555-0142", address: "18 Harbor Road, Alder Bay" },
    typicalReviewDays: 15,
    feeNotes: "Flat electrical permit fee plus plan review; pay at the counter on submission.",
    requiredDocuments: ["equipment-datasheets", "storage-listing", "site-plan"],
  },
  {
    name: "City of Kestrel Falls",
    region: "Westmark",
    necEdition: "2020" as const,
    residentialCode: "none" as const,
    amendments:
      "Stalls in Market Square: ground-mounted arrays need a barrier or guard around live parts; inspections are booked through the portal before the Saturday opening.",
    submissionMethod: "portal" as const,
    contact: { name: "Kestrel Falls Permit Center", email: "permits@kestrelfalls.test", portalUrl: "https://permits.kestrelfalls.test" },
    typicalReviewDays: 10,
    feeNotes: "Fee assessed after intake; paid online before plan review starts.",
    requiredDocuments: ["equipment-datasheets", "storage-listing", "site-plan"],
  },
  {
    name: "Marrow Ridge Township",
    region: "Eastfold",
    necEdition: "2023" as const,
    residentialCode: "IRC-2021" as const,
    amendments:
      "Fire marshal reviews every storage installation over 20 kWh; include the UL 9540 listing and the detection plan. Reflective labels required outdoors.",
    submissionMethod: "email" as const,
    contact: { name: "Township Zoning & Building", email: "building@marrowridge.test" },
    typicalReviewDays: 20,
    feeNotes: "Invoice e-mailed after review; permit released on payment.",
    requiredDocuments: ["equipment-datasheets", "storage-listing", "site-plan", "structural-letter"],
    labelRules: { material: "UV-stable engraved or reflective vinyl", reflective: true, minLetterHeightIn: 0.375 },
  },
];

/**
 * Example project files loaded as the demo's projects, with the state each is
 * left in. Each file's jurisdiction block carries the rules of the demo
 * jurisdiction above of the same name, so a file and its stored project check alike.
 */
export const DEMO_PROJECT_FILES = [
  { file: "examples/market-stall.json", status: "approved" as const },
  { file: "examples/tamarack-hut.json", status: "in-review" as const },
  { file: "examples/ferncliff-farmhouse.json", status: "design" as const },
];
