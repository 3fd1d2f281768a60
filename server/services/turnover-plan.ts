import { NO_PROTOCOL_MESSAGE } from '../../shared/api/protocols';
import {
  buildOpeningStepSet,
  buildStepSet,
  planTurnover,
  protocolFor,
  type Product,
  type Protocol,
  type StepNeed,
  type TurnoverExam,
} from '../../shared/turnover';
import { Refusal } from '../errors';
import type { RoomDay } from './room-day';
import { protocolsOn, type SetupSnapshot } from './site-setup';

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
  /** Applications of the product (re-wet rule) when more than one. */
  applications: number;
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
  /** null only from {@link planRoomTurnoverOrNone} for a room without a protocol. */
  protocol: Protocol | null;
}

/** A product of the site by its key (retired ones too: a past turnover may have used one). */
export function productOf(setup: SetupSnapshot, key: string | null): Product | null {
  return key === null ? null : (setup.engineProducts.find((p) => p.key === key) ?? null);
}

/** Products a technologist may pick on a checklist: the site's active ones. */
export function activeProducts(setup: SetupSnapshot): Product[] {
  const active = new Set(setup.products.filter((p) => p.retired_at === null).map((p) => String(p.id)));
  return setup.engineProducts.filter((p) => active.has(p.key));
}

/**
 * The protocol a room's turnover after `leavingIndex` follows: the version recorded when its
 * exam's end was recorded, else the version in force on the day; null when there is none.
 */
export function protocolOfTurnover(roomDay: RoomDay, leavingIndex: number): Protocol | null {
  const leaving = leavingIndex >= 0 ? roomDay.slots[leavingIndex]?.exam : undefined;
  const recorded = leaving ? roomDay.turnovers.get(leaving.id)?.protocolVersionId : null;
  if (recorded) {
    const protocol = roomDay.setup.engineProtocols.get(recorded);
    if (protocol) return protocol;
  }
  return protocolFor(roomDay.room.modality, protocolsOn(roomDay.setup, roomDay.day));
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
  const protocol = protocolOfTurnover(roomDay, leavingIndex);
  if (!protocol) throw new Refusal('no_protocol', NO_PROTOCOL_MESSAGE(room.modality), { modality: room.modality });
  const products = roomDay.setup.engineProducts;
  const options = { room: turnoverRoom, protocol, arriving, staff, products };
  const set = leaving ? buildStepSet({ ...options, leaving }) : buildOpeningStepSet(options);
  const plan = planTurnover({ ...options, leaving });
  const byKey = new Map(set.steps.map((s) => [s.key, s]));
  const order = new Map(set.steps.map((s, i) => [s.key, i]));
  const steps = [...plan.steps]
    .sort((a, b) => a.start - b.start || a.person - b.person || order.get(a.key)! - order.get(b.key)!)
    .map((scheduled): PlannedStep => {
      const step = byKey.get(scheduled.key)!;
      const contactMinutes = productOf(roomDay.setup, step.productKey)?.contactMinutes ?? 0;
      return {
        key: step.key,
        label: step.label,
        handsOnMinutes: step.handsOnMinutes,
        waitMinutes: step.waitMinutes,
        dryMinutes: step.waitMinutes - contactMinutes,
        contactMinutes,
        productKey: step.productKey,
        applications: step.applications ?? 1,
        needs: step.needs,
        startMs: fromMs + scheduled.start * MINUTE,
        endMs: fromMs + scheduled.end * MINUTE,
        dryAtMs: fromMs + scheduled.dryAt * MINUTE,
        person: scheduled.person,
      };
    });
  return { steps, staff: plan.staff, airHoldMinutes: plan.airHoldMinutes, requiredMinutes: plan.requiredMinutes, protocol };
}

/**
 * The plan, or for a room without a protocol an empty turnover (no steps, 0 minutes): Rooms now
 * keeps showing such a room's exams rather than failing the whole board.
 */
export function planRoomTurnoverOrNone(roomDay: RoomDay, leavingIndex: number, fromMs: number): PlannedTurnover {
  if (protocolOfTurnover(roomDay, leavingIndex)) return planRoomTurnover(roomDay, leavingIndex, fromMs);
  return { steps: [], staff: roomDay.room.staff, airHoldMinutes: 0, requiredMinutes: 0, protocol: null };
}

/**
 * The clean type the log records: `terminal` for the closing clean after the day's last exam,
 * `isolation` after any precaution, else `routine`.
 */
export function cleanTypeOf(precaution: string, hasNextExam: boolean): 'routine' | 'isolation' | 'terminal' {
  if (!hasNextExam) return 'terminal';
  return precaution === 'none' ? 'routine' : 'isolation';
}
