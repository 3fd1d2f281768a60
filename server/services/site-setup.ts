import type { Knex } from 'knex';
import type { ProductKind, ProductView, ProtocolBody, ProtocolVersionView } from '../../shared/api/protocols';
import type { PrecautionRule, Product, Protocol, ProtocolStep, TurnoverRules } from '../../shared/turnover';
import { applicationsOf } from '../../shared/turnover';
import { planVersions } from './day-version';

/** A product row as stored. */
export interface ProductRow {
  id: number;
  name: string;
  kind: string;
  contact_minutes: number;
  stays_wet_minutes: number | null;
  registration: string;
  notes: string;
  retired_at: string | null;
}

/** A protocol version as read: its row with the body parsed. */
export interface StoredVersion {
  id: number;
  modality: string;
  version: number;
  effectiveFrom: string;
  body: ProtocolBody;
  note: string;
  createdAt: string;
  createdBy: { username: string; displayName: string } | null;
}

/**
 * Everything the engine reads from Setup, as one immutable snapshot: every product (retired ones
 * too, so a past day's version still computes) and every protocol version, newest first.
 */
export interface SetupSnapshot {
  setupVersion: number;
  products: readonly ProductRow[];
  /** Engine products, key = id as text. */
  engineProducts: readonly Product[];
  versions: readonly StoredVersion[];
  /** Engine protocols by version id, built once per snapshot. */
  engineProtocols: ReadonlyMap<number, Protocol>;
}

// One snapshot per database, replaced when the `setup` version moves (a trigger raises it on
// every change to products, protocol versions, rooms or settings): a plan never re-reads rules.
const snapshots = new WeakMap<Knex, SetupSnapshot>();

/** The current snapshot, read again only when the setup version moved. */
export async function setupSnapshot(db: Knex): Promise<SetupSnapshot> {
  const { setup } = await planVersions(db, '');
  const cached = snapshots.get(db);
  if (cached && cached.setupVersion === setup) return cached;
  const snapshot = await readSnapshot(db, setup);
  // a write that landed while reading moves the version: keep only what is still current
  if ((await planVersions(db, '')).setup === setup) snapshots.set(db, snapshot);
  return snapshot;
}

/** Reads a snapshot directly (inside a transaction, say), without the cache. */
export async function readSnapshot(db: Knex, setupVersion = -1): Promise<SetupSnapshot> {
  const [products, rows] = await Promise.all([
    db<ProductRow>('products').orderBy('id') as Promise<ProductRow[]>,
    db('protocol_versions as p')
      .leftJoin('users as u', 'u.id', 'p.created_by')
      .orderBy([{ column: 'p.modality' }, { column: 'p.version', order: 'desc' }])
      .select('p.*', 'u.username', 'u.display_name'),
  ]);
  const versions: StoredVersion[] = rows.map((r: Record<string, unknown>) => ({
    id: r['id'] as number,
    modality: r['modality'] as string,
    version: Number(r['version']),
    effectiveFrom: r['effective_from'] as string,
    body: JSON.parse(r['body'] as string) as ProtocolBody,
    note: (r['note'] as string) ?? '',
    createdAt: r['created_at'] as string,
    createdBy: r['username'] ? { username: r['username'] as string, displayName: (r['display_name'] as string) || (r['username'] as string) } : null,
  }));
  return {
    setupVersion,
    products,
    engineProducts: products.map(toEngineProduct),
    versions,
    engineProtocols: new Map(versions.map((v) => [v.id, toEngineProtocol(v)])),
  };
}

export function toEngineProduct(row: Pick<ProductRow, 'id' | 'name' | 'contact_minutes' | 'stays_wet_minutes'>): Product {
  return { key: String(row.id), name: row.name, contactMinutes: Number(row.contact_minutes), staysWetMinutes: row.stays_wet_minutes === null ? null : Number(row.stays_wet_minutes) };
}

/** Version `v` of a modality applies to day D when it is the highest version effective on or before D. */
export function versionFor(snapshot: SetupSnapshot, modality: string, day: string): StoredVersion | null {
  let best: StoredVersion | null = null;
  for (const v of snapshot.versions) {
    if (v.modality !== modality || v.effectiveFrom > day) continue;
    if (!best || v.version > best.version) best = v;
  }
  return best;
}

/** The protocols in force on a day, by modality (`*` included), as the engine takes them. */
export function protocolsOn(snapshot: SetupSnapshot, day: string): Record<string, Protocol> {
  const modalities = new Set(snapshot.versions.map((v) => v.modality));
  const protocols: Record<string, Protocol> = {};
  for (const modality of modalities) {
    const v = versionFor(snapshot, modality, day);
    if (v) protocols[modality] = snapshot.engineProtocols.get(v.id)!;
  }
  return protocols;
}

/** What a day plan's input carries from Setup. */
export function setupForDay(snapshot: SetupSnapshot, day: string): { products: readonly Product[]; protocols: Record<string, Protocol> } {
  return { products: snapshot.engineProducts, protocols: protocolsOn(snapshot, day) };
}

const key = (id: number | null | undefined) => (id === null || id === undefined ? null : String(id));

function toEngineStep(s: ProtocolBody['steps'][number]): ProtocolStep {
  const step: ProtocolStep = {
    key: s.key,
    label: s.label,
    handsOnMinutes: s.handsOnMinutes,
    dryMinutes: s.dryMinutes,
    disinfects: s.disinfects,
    needs: s.needs.map((n) => ({ key: n.key, dry: n.dry })),
  };
  if (s.afterAllOthers) step.afterAllOthers = true;
  if (s.productId !== null) step.productKey = String(s.productId);
  const only = s.onlyWhen;
  if (only && Object.values(only).some((v) => v !== undefined)) step.onlyWhen = { ...only };
  return step;
}

/** A stored body as the engine's protocol, rules included (each modality has its own). */
export function toEngineProtocol(v: Pick<StoredVersion, 'id' | 'modality' | 'version' | 'effectiveFrom' | 'body'>): Protocol {
  const { body } = v;
  const level = (p: ProtocolBody['precautions']['contact']): PrecautionRule => {
    const rule: PrecautionRule = { don: p.don, adjust: p.adjust.map((a) => ({ ...a })), airHold: p.airHold };
    if (p.productId !== null) rule.productKey = String(p.productId);
    return rule;
  };
  const rules: TurnoverRules = {
    defaultProductKey: key(body.defaultProductId),
    precaution: {
      none: { adjust: [], airHold: false },
      contact: level(body.precautions.contact),
      enteric: level(body.precautions.enteric),
      droplet: level(body.precautions.droplet),
      airborne: level(body.precautions.airborne),
    },
    mobility: { ambulatory: body.mobility.ambulatory, wheelchair: body.mobility.wheelchair, stretcher: body.mobility.stretcher },
    coilChange: body.coilChange,
  };
  return {
    modality: v.modality,
    steps: body.steps.map(toEngineStep),
    openingSteps: body.openingSteps.map(toEngineStep),
    rules,
    id: v.id,
    version: v.version,
    effectiveFrom: v.effectiveFrom,
  };
}

/** Product ids a body uses (steps, default, precaution levels). */
export function productIdsOf(body: ProtocolBody): number[] {
  const ids = new Set<number>();
  for (const s of [...body.steps, ...body.openingSteps]) if (s.disinfects && s.productId !== null) ids.add(s.productId);
  if (body.defaultProductId !== null) ids.add(body.defaultProductId);
  for (const p of Object.values(body.precautions)) if (p.productId !== null) ids.add(p.productId);
  return [...ids];
}

export function toProductView(row: ProductRow, usedBy: string[]): ProductView {
  const contactMinutes = Number(row.contact_minutes);
  const staysWetMinutes = row.stays_wet_minutes === null ? null : Number(row.stays_wet_minutes);
  return {
    id: row.id,
    key: String(row.id),
    name: row.name,
    kind: row.kind as ProductKind,
    contactMinutes,
    staysWetMinutes,
    registration: row.registration,
    notes: row.notes,
    retired: row.retired_at !== null,
    applications: applicationsOf({ contactMinutes, staysWetMinutes }),
    usedBy,
  };
}

/** Modalities whose current (on `today`) or a future version uses each product id. */
export function productUse(snapshot: SetupSnapshot, today: string): Map<number, string[]> {
  const use = new Map<number, Set<string>>();
  const modalities = new Set(snapshot.versions.map((v) => v.modality));
  for (const modality of modalities) {
    const current = versionFor(snapshot, modality, today);
    const relevant = snapshot.versions.filter((v) => v.modality === modality && (v === current || v.effectiveFrom > today));
    for (const v of relevant) {
      for (const id of productIdsOf(v.body)) {
        if (!use.has(id)) use.set(id, new Set());
        use.get(id)!.add(modality);
      }
    }
  }
  return new Map([...use].map(([id, set]) => [id, [...set].sort()]));
}

export function toVersionView(v: StoredVersion): ProtocolVersionView {
  return { id: v.id, modality: v.modality, version: v.version, effectiveFrom: v.effectiveFrom, body: v.body, note: v.note, createdAt: v.createdAt, createdBy: v.createdBy };
}
