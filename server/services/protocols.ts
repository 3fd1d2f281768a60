import type { Knex } from 'knex';
import type { Problem } from '../../shared/api/errors';
import {
  FALLBACK_MODALITY,
  type ModalityProtocols,
  type NewProtocolVersion,
  type ProtocolBody,
  type ProtocolList,
  type ProtocolVersionAnswer,
  type ProtocolVersionView,
} from '../../shared/api/protocols';
import { buildOpeningStepSet, buildStepSet, MOBILITIES, PRECAUTIONS, type TurnoverExam } from '../../shared/turnover';
import { NotFoundError, ValidationError } from '../errors';
import { recordAudit, type Actor } from './audit';
import { readSnapshot, toEngineProtocol, toVersionView, versionFor, type SetupSnapshot, type StoredVersion } from './site-setup';
import { siteToday } from './site-today';

type Step = ProtocolBody['steps'][number];

/**
 * Every problem of a protocol body the schema cannot see, with paths a form can put under its
 * fields: duplicate keys, needs naming unknown steps, needs that form a cycle (the steps named
 * in order), disinfecting steps without an active product, unknown or retired products.
 */
export function protocolProblems(body: ProtocolBody, snapshot: SetupSnapshot, prefix = 'body'): Problem[] {
  const problems: Problem[] = [];
  const active = new Set(snapshot.products.filter((p) => p.retired_at === null).map((p) => p.id));
  const known = new Set(snapshot.products.map((p) => p.id));
  const productProblem = (id: number | null, field: string) => {
    if (id === null) return;
    if (!known.has(id)) problems.push({ field, message: `no product ${id}` });
    else if (!active.has(id)) problems.push({ field, message: 'this product is retired; choose an active one' });
  };
  productProblem(body.defaultProductId, `${prefix}.defaultProductId`);
  for (const level of ['contact', 'enteric', 'droplet', 'airborne'] as const) {
    productProblem(body.precautions[level].productId, `${prefix}.precautions.${level}.productId`);
  }
  for (const list of ['steps', 'openingSteps'] as const) {
    const steps = body[list];
    const path = `${prefix}.${list}`;
    const keys = new Map<string, number>();
    steps.forEach((s, i) => {
      if (keys.has(s.key)) problems.push({ field: `${path}.${i}.key`, message: `"${s.key}" is already the key of step ${keys.get(s.key)! + 1}` });
      else keys.set(s.key, i);
      if (s.key === 'don' && Object.values(body.precautions).some((p) => p.don)) {
        problems.push({ field: `${path}.${i}.key`, message: '"don" is the protective-equipment step a precaution adds; use another key' });
      }
      s.needs.forEach((n, j) => {
        if (!keys.has(n.key) && !steps.some((o) => o.key === n.key)) problems.push({ field: `${path}.${i}.needs.${j}.key`, message: `no step "${n.key}" in this list` });
        if (n.key === s.key) problems.push({ field: `${path}.${i}.needs.${j}.key`, message: 'a step cannot need itself' });
      });
      if (s.disinfects) {
        if (s.productId === null && body.defaultProductId === null) {
          problems.push({ field: `${path}.${i}.productId`, message: 'a disinfecting step needs a product (its own or the protocol’s default)' });
        }
        productProblem(s.productId, `${path}.${i}.productId`);
      }
    });
    const cycle = findCycle(steps);
    if (cycle) problems.push({ field: path, message: `needs form a cycle: ${cycle.map((s) => `"${s.label}"`).join(' → ')}` });
  }
  return problems;
}

/**
 * A cycle of needs, as the steps in order (first repeated at the end), or null. A step that
 * comes after all others implicitly needs every regular step, so a regular step needing it is one.
 */
export function findCycle(steps: readonly Step[]): Step[] | null {
  const byKey = new Map(steps.map((s) => [s.key, s]));
  const regular = steps.filter((s) => !s.afterAllOthers);
  const edges = (s: Step): Step[] => {
    const out = s.needs.map((n) => byKey.get(n.key)).filter((x): x is Step => x !== undefined && x !== s);
    return s.afterAllOthers ? [...out, ...regular] : out;
  };
  const state = new Map<Step, 'open' | 'done'>();
  const path: Step[] = [];
  const visit = (s: Step): Step[] | null => {
    if (state.get(s) === 'done') return null;
    if (state.get(s) === 'open') return [...path.slice(path.indexOf(s)), s];
    state.set(s, 'open');
    path.push(s);
    for (const next of edges(s)) {
      const found = visit(next);
      if (found) return found;
    }
    path.pop();
    state.set(s, 'done');
    return null;
  };
  for (const s of steps) {
    const found = visit(s);
    // the steps in the order one waits for the next: reverse the "needs" direction
    if (found) return found.reverse();
  }
  return null;
}

/**
 * What the engine would still refuse once the schema and {@link protocolProblems} pass (a safety
 * net: every precaution and mobility is tried once), as problems on the body.
 */
function engineProblems(modality: string, body: ProtocolBody, snapshot: SetupSnapshot): Problem[] {
  const protocol = toEngineProtocol({ id: 0, modality, version: 0, effectiveFrom: '', body });
  const room = { staff: 1, airChangesPerHour: 12, modality };
  const exam = (o: Partial<TurnoverExam> = {}): TurnoverExam => ({ coil: 'a', precaution: 'none', mobility: 'ambulatory', contrast: false, ...o });
  try {
    buildOpeningStepSet({ room, protocol, products: snapshot.engineProducts, arriving: exam({ contrast: true }) });
    for (const precaution of PRECAUTIONS) {
      for (const mobility of MOBILITIES) {
        buildStepSet({ leaving: exam({ precaution, mobility }), arriving: exam({ coil: 'b', contrast: true }), room, protocol, products: snapshot.engineProducts });
      }
    }
    return [];
  } catch (error) {
    return [{ field: 'body', message: error instanceof Error ? error.message : String(error) }];
  }
}

/** Every problem of a new version: the body's and an effective date before today (site time). */
export function versionProblems(input: Pick<NewProtocolVersion, 'modality' | 'body'> & { effectiveFrom?: string }, snapshot: SetupSnapshot, today: string): Problem[] {
  const problems = protocolProblems(input.body, snapshot);
  if (input.effectiveFrom !== undefined && input.effectiveFrom < today) {
    problems.push({ field: 'effectiveFrom', message: `choose ${today} (today at the site) or later: a past day keeps the version it used` });
  }
  if (problems.length === 0) problems.push(...engineProblems(input.modality, input.body, snapshot));
  return problems;
}

function refuse(problems: Problem[]): never {
  throw new ValidationError(`Invalid protocol: ${problems.map((p) => `${p.field}: ${p.message}`).join('; ')}`, { problems });
}

/** Per modality: the version in force today, the scheduled ones and the older ones. */
export async function listProtocols(db: Knex, now: Date): Promise<ProtocolList> {
  const [snapshot, today, rooms] = await Promise.all([
    readSnapshot(db),
    siteToday(db, now),
    db('rooms').where({ active: true }).select('id', 'modality') as Promise<{ id: number; modality: string }[]>,
  ]);
  const modalities = [...new Set(snapshot.versions.map((v) => v.modality))].sort((a, b) => (a === '*' ? 1 : b === '*' ? -1 : a.localeCompare(b)));
  const own = new Set(modalities.filter((m) => m !== FALLBACK_MODALITY && versionFor(snapshot, m, today)));
  const protocols: ModalityProtocols[] = modalities.map((modality) => {
    const current = versionFor(snapshot, modality, today);
    const mine = snapshot.versions.filter((v) => v.modality === modality);
    return {
      modality,
      current: current ? toVersionView(current) : null,
      future: mine.filter((v) => v.effectiveFrom > today).sort((a, b) => a.version - b.version).map(toVersionView),
      history: mine.filter((v) => v !== current && v.effectiveFrom <= today).sort((a, b) => b.version - a.version).map(toVersionView),
      roomIds: rooms.filter((r) => (modality === FALLBACK_MODALITY ? !own.has(r.modality) : r.modality === modality)).map((r) => r.id),
    };
  });
  const fallback = versionFor(snapshot, FALLBACK_MODALITY, today);
  const missing = fallback ? [] : [...new Set(rooms.map((r) => r.modality))].filter((m) => !own.has(m)).sort();
  return { today, protocols, missing };
}

export async function getProtocolVersion(db: Knex, modality: string, version: number): Promise<ProtocolVersionView> {
  const snapshot = await readSnapshot(db);
  const found = snapshot.versions.find((v) => v.modality === modality && v.version === version);
  if (!found) throw new NotFoundError(`No version ${version} of the ${modality} protocol.`);
  return toVersionView(found);
}

/**
 * Saves a protocol as its modality's next version, effective from a date today or later (the
 * version for day D is the highest effective on or before D, so a past day keeps its own).
 */
export async function createProtocolVersion(db: Knex, input: NewProtocolVersion, by: Actor, now: Date): Promise<ProtocolVersionAnswer> {
  return db.transaction(async (trx) => {
    const [snapshot, today] = await Promise.all([readSnapshot(trx), siteToday(trx, now)]);
    const problems = versionProblems(input, snapshot, today);
    if (problems.length > 0) refuse(problems);
    const latest: StoredVersion | undefined = snapshot.versions.find((v) => v.modality === input.modality);
    const version = (latest?.version ?? 0) + 1;
    const [{ id }] = await trx('protocol_versions').insert({
      modality: input.modality,
      version,
      effective_from: input.effectiveFrom,
      body: JSON.stringify(input.body),
      created_by: by.id,
      created_at: now.toISOString(),
      note: input.note,
    }).returning('id');
    await recordAudit(
      trx,
      by,
      {
        area: 'protocol',
        action: 'version added',
        subject: input.modality === FALLBACK_MODALITY ? 'Fallback (*)' : input.modality,
        before: latest ? { version: latest.version, effectiveFrom: latest.effectiveFrom } : null,
        after: { version, effectiveFrom: input.effectiveFrom, steps: input.body.steps.map((s) => s.label), note: input.note },
      },
      now,
    );
    const saved = (await readSnapshot(trx)).versions.find((v) => v.id === id)!;
    return { protocol: toVersionView(saved), warnings: [] };
  });
}
