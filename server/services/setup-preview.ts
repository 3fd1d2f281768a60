import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import {
  FALLBACK_MODALITY,
  PREVIEW_DAYS,
  type EffectPreview,
  type PreviewGapType,
  type PreviewRequired,
  type PreviewVerdictChange,
  type ProductFields,
  type ProtocolBody,
} from '../../shared/api/protocols';
import type { DayPlan, PlanGap } from '../../shared/api/plan';
import { computeDayPlan, planTurnover, protocolFor, type DayPlanInput, type Product, type Protocol, type TurnoverExam } from '../../shared/turnover';
import { NotFoundError } from '../errors';
import { loadDayPlan, loadDayPlanInput } from './day-plan';
import { productWarnings } from './products';
import { versionProblems } from './protocols';
import { readSnapshot, toEngineProduct, toEngineProtocol, versionFor, type SetupSnapshot } from './site-setup';
import { siteToday } from './site-today';

const plain = (o: Partial<TurnoverExam> = {}): TurnoverExam => ({ coil: 'head', precaution: 'none', mobility: 'ambulatory', contrast: false, ...o });

const GAPS: Record<PreviewGapType, { leaving: TurnoverExam | null; arriving: TurnoverExam }> = {
  plain: { leaving: plain(), arriving: plain() },
  'contrast-next': { leaving: plain(), arriving: plain({ contrast: true }) },
  'coil-change': { leaving: plain(), arriving: plain({ coil: 'knee' }) },
  contact: { leaving: plain({ precaution: 'contact' }), arriving: plain() },
  enteric: { leaving: plain({ precaution: 'enteric' }), arriving: plain() },
  droplet: { leaving: plain({ precaution: 'droplet' }), arriving: plain() },
  airborne: { leaving: plain({ precaution: 'airborne' }), arriving: plain() },
  opening: { leaving: null, arriving: plain() },
};

/** A draft: protocols and products as they would be (by modality; the products list replaced). */
interface Draft {
  protocols: (current: Readonly<Record<string, Protocol>>) => Record<string, Protocol>;
  products: (current: readonly Product[]) => readonly Product[];
  /** Modalities whose required minutes the answer lists. */
  modalities: (current: Readonly<Record<string, Protocol>>) => string[];
}

/** Required minutes of each common gap type, one person, in a room of the modality (its air changes). */
function requiredOf(protocol: Protocol | null, products: readonly Product[], room: { airChangesPerHour: number }, gapType: PreviewGapType): number | null {
  if (!protocol) return null;
  const gap = GAPS[gapType];
  try {
    return planTurnover({ ...gap, room: { staff: 1, airChangesPerHour: room.airChangesPerHour, modality: protocol.modality }, protocol, products }).requiredMinutes;
  } catch {
    return null; // a draft the engine refuses: its problems are listed in the answer
  }
}

function gapsById(plan: DayPlan): Map<number, { gap: PlanGap; room: DayPlan['rooms'][number] }> {
  const map = new Map<number, { gap: PlanGap; room: DayPlan['rooms'][number] }>();
  for (const room of plan.rooms) for (const gap of room.gaps) map.set(gap.toExamId, { gap, room });
  return map;
}

/**
 * The draft's effect: required minutes of the common gap types before → after, and every gap of
 * today and the next 7 days whose verdict would change. Bounded work: 8 days, each planned once
 * more with the draft (the "before" plans are the cached ones); the engine answers a 10,000-exam
 * day in tens of milliseconds, and days hold what imports allow.
 */
async function preview(db: Knex, now: Date, draft: Draft, problems: EffectPreview['problems'], warnings: EffectPreview['warnings']): Promise<EffectPreview> {
  const today = await siteToday(db, now);
  const days = Array.from({ length: PREVIEW_DAYS }, (_, i) => DateTime.fromISO(today, { zone: 'UTC' }).plus({ days: i }).toISODate()!);
  const firstInput = await loadDayPlanInput(db, today);
  const roomOf = (modality: string) => firstInput.rooms.find((r) => r.modality === modality) ?? { airChangesPerHour: 12 };
  const afterProtocols = draft.protocols(firstInput.protocols);
  const afterProducts = draft.products(firstInput.products);
  const required: PreviewRequired[] = [];
  for (const modality of draft.modalities(firstInput.protocols)) {
    const lookup = modality === FALLBACK_MODALITY ? (p: Readonly<Record<string, Protocol>>) => p[FALLBACK_MODALITY] ?? null : (p: Readonly<Record<string, Protocol>>) => protocolFor(modality, p);
    const room = roomOf(modality);
    for (const gapType of Object.keys(GAPS) as PreviewGapType[]) {
      required.push({
        modality,
        gapType,
        before: requiredOf(lookup(firstInput.protocols), firstInput.products, room, gapType),
        after: problems.length > 0 ? null : requiredOf(lookup(afterProtocols), afterProducts, room, gapType),
      });
    }
  }
  const changes: PreviewVerdictChange[] = [];
  if (problems.length === 0) {
    for (const day of days) {
      const input: DayPlanInput = await loadDayPlanInput(db, day);
      if (input.exams.length === 0) continue;
      const stored = await loadDayPlan(db, day);
      const before = gapsById(stored);
      const after = gapsById(computeDayPlan({ ...input, protocols: draft.protocols(input.protocols), products: draft.products(input.products) }));
      const accession = new Map(input.exams.map((e) => [e.id, e.accession]));
      const start = new Map(stored.rooms.flatMap((r) => r.exams.map((e) => [e.id, e.start] as const)));
      for (const id of new Set([...before.keys(), ...after.keys()])) {
        const b = before.get(id);
        const a = after.get(id);
        if (b?.gap.verdict === a?.gap.verdict) continue;
        const room = (a ?? b)!.room;
        const gap = (a ?? b)!.gap;
        changes.push({
          date: day,
          roomId: room.id,
          roomName: room.name,
          time: start.get(id)!,
          accessions: [gap.fromExamId === null ? null : accession.get(gap.fromExamId)!, accession.get(id)!],
          before: b ? { verdict: b.gap.verdict, requiredMinutes: b.gap.requiredMinutes } : null,
          after: a ? { verdict: a.gap.verdict, requiredMinutes: a.gap.requiredMinutes } : null,
        });
      }
    }
  }
  return { days, required, changes, problems, warnings };
}

/** `POST /api/protocols/preview`: the draft as the modality's protocol from today on. */
export async function previewProtocol(db: Knex, modality: string, body: ProtocolBody, now: Date): Promise<EffectPreview> {
  const [snapshot, today] = await Promise.all([readSnapshot(db), siteToday(db, now)]);
  const problems = versionProblems({ modality, body }, snapshot, today);
  const draft = toEngineProtocol({ id: 0, modality, version: (latestVersion(snapshot, modality) ?? 0) + 1, effectiveFrom: today, body });
  return preview(
    db,
    now,
    {
      protocols: (current) => ({ ...current, [modality]: draft }),
      products: (current) => current,
      modalities: () => [modality],
    },
    problems,
    [],
  );
}

function latestVersion(snapshot: SetupSnapshot, modality: string): number | null {
  return snapshot.versions.find((v) => v.modality === modality)?.version ?? null;
}

/** `POST /api/products/:id/preview`: the product's draft fields in every protocol from today on. */
export async function previewProduct(db: Knex, id: number, fields: ProductFields, now: Date): Promise<EffectPreview> {
  const [snapshot, today] = await Promise.all([readSnapshot(db), siteToday(db, now)]);
  const row = snapshot.products.find((p) => p.id === id);
  if (!row) throw new NotFoundError(`No product ${id}.`);
  const changed = toEngineProduct({ id, name: fields.name, contact_minutes: fields.contactMinutes, stays_wet_minutes: fields.staysWetMinutes });
  const modalities = [...new Set(snapshot.versions.map((v) => v.modality))].filter((m) => versionFor(snapshot, m, today));
  return preview(
    db,
    now,
    {
      protocols: (current) => current,
      products: (current) => current.map((p) => (p.key === changed.key ? changed : p)),
      modalities: () => modalities,
    },
    [],
    productWarnings(fields),
  );
}
