// The demo cast: a fictional technical college's mechatronics lab (invented by Loopwright; every
// name and address is made up). Demo credentials are for local demo installations only.

export const DEMO_PASSWORD = "demo-loop-2026";
export const DEMO_ORGANIZATION = "Kestrel Fen Technical College — Mechatronics Lab";
export const DEMO_COHORT = "Process Control 2 — Spring block";

export const demoPeople = {
  admin: { email: "admin@kestrelfen.example", displayName: "Ines Varga", role: "admin" as const },
  instructors: [
    { email: "m.okafor@kestrelfen.example", displayName: "Marcus Okafor", role: "instructor" as const },
    { email: "h.lindqvist@kestrelfen.example", displayName: "Hanne Lindqvist", role: "instructor" as const },
  ],
  trainees: [
    "Arjun Mehta",
    "Bea Castell",
    "Cormac Doyle",
    "Dalia Rahman",
    "Emil Sørby",
    "Fenna Brouwer",
    "Gideon Ashe",
    "Hoa Tran",
  ].map((name) => ({
    email: `${name.split(" ")[0].toLowerCase()}@students.kestrelfen.example`,
    displayName: name,
    role: "trainee" as const,
  })),
};
