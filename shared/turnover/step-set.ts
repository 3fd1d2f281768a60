import { airHoldMinutes } from './air-hold';
import type {
  Mobility,
  Precaution,
  Product,
  Protocol,
  ProtocolStep,
  StepAdjustment,
  StepNeed,
  StepSet,
  TurnoverExam,
  TurnoverRoom,
  TurnoverRules,
  TurnoverStep,
} from './model';
import { applicationsOf } from './protocols';

export interface BuildStepSetOptions {
  leaving: TurnoverExam;
  arriving: TurnoverExam;
  room: TurnoverRoom;
  protocol: Protocol;
  /** The site's products; every product a step uses must be among them. */
  products: readonly Product[];
  /** Rules when the protocol carries none of its own. */
  rules?: TurnoverRules;
  /** People on this turnover; default the room's staff. */
  staff?: number;
}

export interface BuildOpeningStepSetOptions {
  room: TurnoverRoom;
  protocol: Protocol;
  products: readonly Product[];
  /** The day's first exam, if known (its contrast adds the contrast-only opening steps). */
  arriving?: TurnoverExam | null;
  rules?: TurnoverRules;
  staff?: number;
}

/**
 * The steps of the turnover between leaving exam A and arriving exam B: the protocol's steps
 * with the rules applied (A's precaution and mobility, a coil change, B's contrast).
 *
 * @throws Error on an unknown precaution, mobility, product or need, or a protocol without rules;
 *   RangeError on bad minutes
 *   or, for airborne precautions, a room without a valid air-change rate
 * @example
 * const set = buildStepSet({ leaving, arriving, room, protocol: MR_PROTOCOL, products });
 * set.steps.map((s) => s.key); // ['clear', 'bore', …, 'hygiene']
 */
export function buildStepSet(options: BuildStepSetOptions): StepSet {
  const { leaving, arriving, room, protocol } = options;
  const rules = rulesOf(protocol, options.rules);
  const precaution = rules.precaution[leaving.precaution];
  if (!precaution) throw new Error(`unknown precaution "${leaving.precaution}"`);
  const mobility = rules.mobility[leaving.mobility];
  if (!mobility) throw new Error(`unknown mobility "${leaving.mobility}"`);

  const coilChange = coilChanges(leaving, arriving);
  const adjustments = [...precaution.adjust, ...mobility, ...(coilChange ? rules.coilChange : [])];
  const steps = resolveSteps(protocol.steps, {
    when: { contrast: arriving.contrast, coilChange, mobility: leaving.mobility, precaution: leaving.precaution },
    adjustments,
    products: options.products,
    productKey: precaution.productKey ?? null,
    defaultProductKey: rules.defaultProductKey,
  });
  if (precaution.don) addDon(steps, precaution.don);
  return {
    steps,
    staff: options.staff ?? room.staff,
    airHoldMinutes: precaution.airHold ? airHoldMinutes(room.airChangesPerHour) : 0,
  };
}

/**
 * The steps between the room's opening and the day's first exam (e.g. workstation wipe-down).
 *
 * @example
 * buildOpeningStepSet({ room, protocol: MR_PROTOCOL, products }).steps.map((s) => s.key); // ['workstation', 'roomcheck']
 */
export function buildOpeningStepSet(options: BuildOpeningStepSetOptions): StepSet {
  const rules = rulesOf(options.protocol, options.rules);
  const steps = resolveSteps(options.protocol.openingSteps, {
    when: { contrast: options.arriving?.contrast ?? false, coilChange: false, mobility: null, precaution: null },
    adjustments: [],
    products: options.products,
    productKey: null,
    defaultProductKey: rules.defaultProductKey,
  });
  return { steps, staff: options.staff ?? options.room.staff, airHoldMinutes: 0 };
}

/**
 * Whether the coil changes between A and B: case-insensitive, and a missing coil on either side
 * counts as no change (nothing to swap that the plan knows of).
 *
 * @example
 * coilChanges({ coil: 'Head' } as TurnoverExam, { coil: 'head' } as TurnoverExam); // false
 */
export function coilChanges(leaving: Pick<TurnoverExam, 'coil'>, arriving: Pick<TurnoverExam, 'coil'>): boolean {
  const a = leaving.coil?.trim().toLowerCase();
  const b = arriving.coil?.trim().toLowerCase();
  return !!a && !!b && a !== b;
}

function rulesOf(protocol: Protocol, fallback: TurnoverRules | undefined): TurnoverRules {
  const rules = protocol.rules ?? fallback;
  if (!rules) throw new Error(`protocol "${protocol.modality}" has no precaution, mobility and coil-change rules`);
  return rules;
}

function findProduct(products: readonly Product[], key: string): Product {
  const product = products.find((p) => p.key === key);
  if (!product) throw new Error(`unknown product "${key}"`);
  if (!Number.isFinite(product.contactMinutes) || product.contactMinutes < 0) {
    throw new RangeError(`product "${key}" has an invalid contact time ${product.contactMinutes}`);
  }
  return product;
}

/** What decides whether a conditional step is part of this turnover (null: no leaving exam). */
interface StepWhen {
  contrast: boolean;
  coilChange: boolean;
  mobility: Mobility | null;
  precaution: Precaution | null;
}

interface ResolveContext {
  when: StepWhen;
  adjustments: StepAdjustment[];
  products: readonly Product[];
  /** The precaution's product for every disinfecting step, if it sets one. */
  productKey: string | null;
  defaultProductKey: string | null;
}

function applies(s: ProtocolStep, when: StepWhen): boolean {
  if (s.onlyWithContrast && !when.contrast) return false;
  const only = s.onlyWhen;
  if (!only) return true;
  if (only.contrast !== undefined && only.contrast !== when.contrast) return false;
  if (only.coilChange !== undefined && only.coilChange !== when.coilChange) return false;
  if (only.mobility && (when.mobility === null || !only.mobility.includes(when.mobility))) return false;
  if (only.precaution && (when.precaution === null || !only.precaution.includes(when.precaution))) return false;
  return true;
}

function productOf(s: ProtocolStep, ctx: ResolveContext): Product {
  const key = ctx.productKey ?? s.productKey ?? ctx.defaultProductKey;
  if (key === null || key === undefined) throw new Error(`step "${s.key}" disinfects but has no product`);
  return findProduct(ctx.products, key);
}

function resolveSteps(protocolSteps: readonly ProtocolStep[], ctx: ResolveContext): TurnoverStep[] {
  const allKeys = new Set<string>();
  for (const s of protocolSteps) {
    if (allKeys.has(s.key)) throw new Error(`protocol has step "${s.key}" twice`);
    allKeys.add(s.key);
  }
  const kept = protocolSteps.filter((s) => applies(s, ctx.when));
  const keptKeys = new Set(kept.map((s) => s.key));
  const regularKeys = kept.filter((s) => !s.afterAllOthers).map((s) => s.key);
  return kept.map((s) => {
    for (const need of s.needs) {
      if (!allKeys.has(need.key)) throw new Error(`step "${s.key}" needs unknown step "${need.key}"`);
    }
    // A need on a step left out (contrast-only, no contrast) is met by nothing to do.
    const needs: StepNeed[] = s.needs.filter((n) => keptKeys.has(n.key)).map((n) => ({ ...n }));
    if (s.afterAllOthers) {
      for (const key of regularKeys) if (!needs.some((n) => n.key === key)) needs.push({ key, dry: false });
    }
    if (!Number.isFinite(s.dryMinutes) || s.dryMinutes < 0) {
      throw new RangeError(`step "${s.key}" has an invalid dry time ${s.dryMinutes}`);
    }
    const product = s.disinfects ? productOf(s, ctx) : null;
    // Re-wet rule: a product that dries before its contact time is applied again, each time by hand.
    const applications = product ? applicationsOf(product) : 1;
    const step: TurnoverStep = {
      key: s.key,
      label: s.label,
      handsOnMinutes: adjust(s.key, s.handsOnMinutes, ctx.adjustments) * applications,
      waitMinutes: product ? product.contactMinutes + s.dryMinutes : s.dryMinutes,
      needs,
      productKey: product ? product.key : null,
    };
    if (applications > 1) step.applications = applications;
    return step;
  });
}

function adjust(key: string, minutes: number, adjustments: StepAdjustment[]): number {
  let result = minutes;
  for (const a of adjustments) {
    if (a.step !== key) continue;
    if (a.setMinutes !== undefined) result = a.setMinutes;
    if (a.addMinutes !== undefined) result += a.addMinutes;
  }
  if (!Number.isFinite(result) || result < 0) throw new RangeError(`step "${key}" has invalid hands-on time ${result}`);
  return result;
}

/** Protective equipment goes on before anything else: every first step needs `don`. */
function addDon(steps: TurnoverStep[], don: { label: string; handsOnMinutes: number }): void {
  if (steps.some((s) => s.key === 'don')) throw new Error('protocol already has a step "don"');
  for (const s of steps) if (s.needs.length === 0) s.needs.push({ key: 'don', dry: false });
  steps.unshift({ key: 'don', label: don.label, handsOnMinutes: don.handsOnMinutes, waitMinutes: 0, needs: [], productKey: null });
}
