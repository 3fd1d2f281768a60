import {
  buildOpeningStepSet,
  buildStepSet,
  DEFAULT_PRODUCTS,
  planTurnover,
  protocolFor,
  type Product,
  type StepNeed,
  type TurnoverExam,
} from '../../shared/turnover';
import type { RoomDay } from './room-day';

const MINUTE = 60_000;

/** The exam the closing clean is planned for: nothing special, so no coil change or contrast prep. */
const NOBODY_NEXT: TurnoverExam = { coil: null, precaution: 'none', mobility: 'ambulatory', contrast: false };

/** A step of a turnover as the engine planned it, placed in real time. */
export interface PlannedStep {
  key: string;
  label: string;
  handsOnMinutes: number;
  /** Planned wait after the step: the default product's contact time + the surface's dry time. */
  waitMinutes: number;
  /** The surface's dry time alone, so a different product's contact time can replace the default's. */
  dryMinutes: number;
  contactMinutes: number;
  productKey: string | null;
  needs: StepNeed[];
  startMs: number;
  endMs: number;
  dryAtMs: number;
  person: number;
}

export interface PlannedTurnover {
  steps: PlannedStep[];
  staff: number;
  airHoldMinutes: number;
  requiredMinutes: number;
}

export const PRODUCTS: readonly Product[] = DEFAULT_PRODUCTS;

export function productOf(key: string | null): Product | null {
  return key === null ? null : (PRODUCTS.find((p) => p.key === key) ?? null);
}

/**
 * The engine's plan for the turnover after the exam at `leavingIndex` (or the room's opening
 * when -1), starting at `fromMs` (the actual or expected end), with the gap's staffing.
 * Steps come in the engine's computed order: by planned start, then person.
 */
export function planRoomTurnover(roomDay: RoomDay, leavingIndex: number, fromMs: number): PlannedTurnover {
  const { room, slots } = roomDay;
  const leaving = leavingIndex >= 0 ? slots[leavingIndex]!.exam : null;
  const arrivingSlot = slots[leavingIndex + 1];
  const arriving: TurnoverExam = arrivingSlot?.exam ?? NOBODY_NEXT;
  const staff = (arrivingSlot && roomDay.staffOverrides.get(arrivingSlot.exam.id)) ?? room.staff;
  const turnoverRoom = { staff: room.staff, airChangesPerHour: room.airChangesPerHour, modality: room.modality };
  const protocol = protocolFor(room.modality);
  const options = { room: turnoverRoom, protocol, arriving, staff, products: PRODUCTS };
  const set = leaving ? buildStepSet({ ...options, leaving }) : buildOpeningStepSet(options);
  const plan = planTurnover({ ...options, leaving });
  const byKey = new Map(set.steps.map((s) => [s.key, s]));
  const order = new Map(set.steps.map((s, i) => [s.key, i]));
  const steps = [...plan.steps]
    .sort((a, b) => a.start - b.start || a.person - b.person || order.get(a.key)! - order.get(b.key)!)
    .map((scheduled): PlannedStep => {
      const step = byKey.get(scheduled.key)!;
      const contactMinutes = productOf(step.productKey)?.contactMinutes ?? 0;
      return {
        key: step.key,
        label: step.label,
        handsOnMinutes: step.handsOnMinutes,
        waitMinutes: step.waitMinutes,
        dryMinutes: step.waitMinutes - contactMinutes,
        contactMinutes,
        productKey: step.productKey,
        needs: step.needs,
        startMs: fromMs + scheduled.start * MINUTE,
        endMs: fromMs + scheduled.end * MINUTE,
        dryAtMs: fromMs + scheduled.dryAt * MINUTE,
        person: scheduled.person,
      };
    });
  return { steps, staff: plan.staff, airHoldMinutes: plan.airHoldMinutes, requiredMinutes: plan.requiredMinutes };
}

/**
 * The clean type the log records: `terminal` for the closing clean after the day's last exam,
 * `isolation` after any precaution, else `routine`.
 */
export function cleanTypeOf(precaution: string, hasNextExam: boolean): 'routine' | 'isolation' | 'terminal' {
  if (!hasNextExam) return 'terminal';
  return precaution === 'none' ? 'routine' : 'isolation';
}
