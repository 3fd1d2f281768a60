import type { Knex } from 'knex';
import type { BoardSlot, Checklist, ChecklistStep } from '../../shared/api/board';
import { zonedFormatter } from '../../shared/turnover';
import { NotFoundError } from '../errors';
import { lastFinishedIndex, loadRoomDays, type ExamSlot, type RoomDay, type TurnoverRecord } from './room-day';
import { shiftTasksOfDay } from './shift-tasks';
import { activeProducts, cleanTypeOf, planRoomTurnover, protocolOfTurnover } from './turnover-plan';
import { NO_PROTOCOL_MESSAGE } from '../../shared/api/protocols';
import { Refusal } from '../errors';
import { replanFromNow, turnoverProgress } from './turnover-progress';

const MINUTE = 60_000;

/** Which turnover a room's checklist shows, and from when it is planned. */
interface Focus {
  /** The leaving exam's index; -1 for the opening before the first exam. */
  leavingIndex: number;
  record: TurnoverRecord | null;
  fromMs: number;
}

/**
 * The room's current turnover (its latest recorded one while not complete); else the next
 * one to do: after the exam in progress or next up, or the opening before the first exam while
 * no exam has started; after the day's last exam, the last turnover as recorded.
 */
function focusOf(roomDay: RoomDay, nowMs: number): Focus | null {
  const { slots, turnovers } = roomDay;
  const last = lastFinishedIndex(roomDay);
  const lastRecord = last >= 0 ? turnovers.get(slots[last]!.exam.id)! : null;
  if (lastRecord && lastRecord.completedMs === null) return { leavingIndex: last, record: lastRecord, fromMs: lastRecord.examEndedMs };
  const next = slots[last + 1];
  if (!next) return lastRecord ? { leavingIndex: last, record: lastRecord, fromMs: lastRecord.examEndedMs } : null;
  if (last < 0 && next.startMs > nowMs) return { leavingIndex: -1, record: null, fromMs: roomDay.openMs };
  // an exam running over its slot ends no earlier than now
  return { leavingIndex: last + 1, record: null, fromMs: next.startMs <= nowMs ? Math.max(next.endMs, nowMs) : next.endMs };
}

/**
 * The air hold counts from the recorded end only (`untilMs`); before "Exam finished" there is
 * just the plan, and either is flagged when it ends after the next patient's slot has started.
 */
function airHoldOf(minutes: number, fromMs: number, record: TurnoverRecord | null, arriving: ExamSlot | undefined) {
  if (minutes <= 0) return { untilMs: null, plannedUntilMs: null, pastNextStartMinutes: 0 };
  const plannedUntilMs = fromMs + minutes * MINUTE;
  const untilMs = record ? record.examEndedMs + minutes * MINUTE : null;
  const past = arriving ? plannedUntilMs - arriving.startMs : 0;
  return { untilMs, plannedUntilMs, pastNextStartMinutes: past > 0 ? Math.ceil(past / MINUTE) : 0 };
}

/** An exam as the board and the checklist show it, times in the site's offset. */
export function toBoardSlot(slot: ExamSlot | undefined, format: (ms: number) => string): BoardSlot | null {
  if (!slot) return null;
  const { exam } = slot;
  return {
    examId: exam.id,
    accession: exam.accession,
    procedure: exam.procedure,
    start: format(slot.startMs),
    end: format(slot.endMs),
    precaution: exam.precaution,
    arrivedAt: slot.arrivedAt,
  };
}

/** The checklist of a room's current or next turnover, or of one given turnover. */
export async function loadChecklist(db: Knex, roomId: number, day: string, now: Date, turnoverId?: number): Promise<Checklist> {
  const [roomDay] = await loadRoomDays(db, day, [roomId]);
  if (!roomDay) throw new NotFoundError(`No room ${roomId}.`);
  const format = zonedFormatter(roomDay.zone);
  const nowMs = now.getTime();
  let focus = focusOf(roomDay, nowMs);
  if (turnoverId !== undefined) {
    const record = [...roomDay.turnovers.values()].find((t) => t.id === turnoverId);
    if (!record) throw new NotFoundError(`No turnover ${turnoverId} in this room on ${day}.`);
    const leavingIndex = roomDay.slots.findIndex((s) => s.exam.id === record.fromExamId);
    if (leavingIndex < 0) throw new NotFoundError(`The exam before turnover ${turnoverId} is no longer in this room.`);
    focus = { leavingIndex, record, fromMs: record.examEndedMs };
  }
  const tasks = (await shiftTasksOfDay(db, [roomId], day, roomDay.zone, now)).get(roomId)!;
  const { room, slots } = roomDay;
  // A room without a protocol has no checklist to show (409 no_protocol), never invented steps.
  const protocol = protocolOfTurnover(roomDay, focus?.leavingIndex ?? -1);
  if (!protocol) throw new Refusal('no_protocol', NO_PROTOCOL_MESSAGE(room.modality), { modality: room.modality });
  const protocolRef = protocol.id ? { id: protocol.id, modality: protocol.modality, version: protocol.version!, effectiveFrom: protocol.effectiveFrom! } : null;
  const products = activeProducts(roomDay.setup).map(({ key, name, contactMinutes }) => ({ key, name, contactMinutes }));
  const base = { roomId, roomName: room.name, modality: room.modality, date: day, now: format(nowMs), products, tasks, protocol: protocolRef };
  if (!focus) {
    return { ...base, turnoverId: null, leaving: null, arriving: null, examEndedAt: null, cleanType: 'routine', precaution: 'none', staff: room.staff, airHoldMinutes: 0, airHoldUntil: null, airHoldPlannedUntil: null, airHoldPastNextStartMinutes: 0, steps: [], readyAt: null, completedAt: null };
  }
  const { leavingIndex, record, fromMs } = focus;
  const leaving = slots[leavingIndex];
  const arriving = slots[leavingIndex + 1];
  const planned = planRoomTurnover(roomDay, leavingIndex, fromMs);
  const progress = record ? turnoverProgress(planned, record, nowMs) : null;
  const precaution = leaving?.exam.precaution ?? 'none';
  const { steps: shown, shiftMs } = replanFromNow(planned, record, nowMs);
  const steps = shown.map((s): ChecklistStep => {
    const tick = record?.ticks.get(s.key);
    return {
      key: s.key,
      label: s.label,
      handsOnMinutes: s.handsOnMinutes,
      waitMinutes: s.waitMinutes,
      contactMinutes: s.contactMinutes,
      needsDry: s.needs.filter((n) => n.dry).map((n) => n.key),
      productKey: s.productKey,
      applications: s.applications,
      planned: { start: format(s.startMs), end: format(s.endMs), dryAt: format(s.dryAtMs), person: s.person },
      done: tick ? { at: tick.doneAt, by: tick.by, productKey: tick.productKey, earlyReason: tick.earlyReason } : null,
      wetUntil: tick ? format(progress!.wetUntilMs.get(s.key)!) : null,
    };
  });
  const hold = airHoldOf(planned.airHoldMinutes, fromMs, record, arriving);
  // An estimate until complete, up to the whole minute as Rooms now shows it (a room ready at
  // 13:56:30 is not ready at 13:56); once complete, when it was.
  const readyAtMs = progress ? progress.readyAtMs : fromMs + shiftMs + planned.requiredMinutes * MINUTE;
  return {
    ...base,
    turnoverId: record?.id ?? null,
    leaving: toBoardSlot(leaving, format),
    arriving: toBoardSlot(arriving, format),
    examEndedAt: record?.examEndedAt ?? null,
    cleanType: record?.cleanType ?? (leaving ? cleanTypeOf(precaution, Boolean(arriving)) : 'routine'),
    precaution,
    staff: planned.staff,
    airHoldMinutes: planned.airHoldMinutes,
    airHoldUntil: hold.untilMs === null ? null : format(hold.untilMs),
    airHoldPlannedUntil: hold.plannedUntilMs === null ? null : format(hold.plannedUntilMs),
    airHoldPastNextStartMinutes: hold.pastNextStartMinutes,
    steps,
    readyAt: format(record?.completedAt ? readyAtMs : Math.ceil(readyAtMs / MINUTE) * MINUTE),
    completedAt: record?.completedAt ?? null,
  };
}
