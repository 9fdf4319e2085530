import { factorSetSchema, parseFactorSet, type FactorSet, type FactorSetIssue } from "./factor-set-schema";
import { EU_MRR } from "./factor-sets/eu-mrr";
import { IPCC_2006 } from "./factor-sets/ipcc-2006";
import { US_40CFR98 } from "./factor-sets/us-40cfr98";

export const BUILT_IN_FACTOR_SETS: readonly FactorSet[] = [IPCC_2006, US_40CFR98, EU_MRR];

export class FactorSetError extends Error {
  constructor(readonly issues: FactorSetIssue[]) {
    super(issues.map((i) => `${i.path}: ${i.message}`).join("; "));
    this.name = "FactorSetError";
  }
}

/**
 * Built-in sets plus an organisation's own. Built-ins are validated like any custom set so a
 * typo in shipped data fails loudly; a custom set may not shadow a built-in id (a statement must
 * always mean the same thing by "eu-mrr").
 */
export class FactorSetRegistry {
  private readonly sets = new Map<string, FactorSet>();

  constructor(custom: unknown[] = []) {
    for (const s of BUILT_IN_FACTOR_SETS) this.sets.set(s.id, factorSetSchema.parse(s));
    for (const c of custom) this.add(c);
  }

  /** Validate and add a custom set given as parsed JSON; throws FactorSetError with JSON paths. */
  add(json: unknown): FactorSet {
    const r = parseFactorSet(json);
    if (!r.ok) throw new FactorSetError(r.issues);
    if (this.sets.has(r.set.id)) {
      throw new FactorSetError([{ path: "$.id", message: `a factor set "${r.set.id}" already exists` }]);
    }
    this.sets.set(r.set.id, r.set);
    return r.set;
  }

  get(id: string): FactorSet | undefined {
    return this.sets.get(id);
  }

  ids(): string[] {
    return [...this.sets.keys()];
  }

  isBuiltIn(id: string): boolean {
    return BUILT_IN_FACTOR_SETS.some((s) => s.id === id);
  }
}

export const defaultRegistry = new FactorSetRegistry();
