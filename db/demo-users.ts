import type { Role } from "@/lib/auth/roles";

/** Demo accounts of the invented organisation; listed in the README. Never use these elsewhere. */
export const DEMO_ORGANISATION = { name: "Vellmar Nitrogen Co.", slug: "vellmar" } as const;

export const DEMO_USERS: { email: string; name: string; password: string; roles: Role[] }[] = [
  { email: "admin@vellmar.example", name: "Ilse Varga", password: "Admin#Vellmar2026", roles: ["administrator"] },
  { email: "engineer@vellmar.example", name: "Tomas Ekwueme", password: "Engineer#Vellmar2026", roles: ["process_engineer"] },
  { email: "officer@vellmar.example", name: "Maren Holt", password: "Officer#Vellmar2026", roles: ["environmental_officer"] },
  { email: "signatory@vellmar.example", name: "Rafael Okonkwo-Lind", password: "Signatory#Vellmar2026", roles: ["signatory"] },
  { email: "auditor@vellmar.example", name: "Noor Castellan", password: "Auditor#Vellmar2026", roles: ["auditor"] },
];
