import type { Knex } from 'knex';
import type { SetupChecklist, SetupChecklistItem } from '../../shared/api/protocols';
import { ROLE_LABELS, ROLES } from '../../shared/api/auth';
import { listProtocols } from './protocols';

/** What a new department still has to set up before the plan can use its own rules. */
export async function setupChecklist(db: Knex, now: Date): Promise<SetupChecklist> {
  const [rooms, products, protocols, users] = await Promise.all([
    db('rooms').where({ active: true }).count({ n: '*' }),
    db('products').whereNull('retired_at').count({ n: '*' }),
    listProtocols(db, now),
    db('users').where({ active: true }).groupBy('role').select('role').count({ n: '*' }),
  ]);
  const roles = new Set((users as unknown as { role: string }[]).map((u) => u.role));
  const items: SetupChecklistItem[] = [
    { key: 'rooms', done: Number(rooms[0]!['n']) > 0, missing: Number(rooms[0]!['n']) > 0 ? [] : ['at least one room'] },
    { key: 'products', done: Number(products[0]!['n']) > 0, missing: Number(products[0]!['n']) > 0 ? [] : ['at least one disinfectant product'] },
    {
      key: 'protocols',
      done: protocols.missing.length === 0 && protocols.protocols.some((p) => p.current),
      missing: protocols.missing.length > 0 ? protocols.missing.map((m) => `a protocol for ${m} (or a * fallback)`) : protocols.protocols.some((p) => p.current) ? [] : ['at least one protocol'],
    },
    { key: 'users', done: ROLES.every((r) => roles.has(r)), missing: ROLES.filter((r) => !roles.has(r)).map((r) => `no ${ROLE_LABELS[r].toLowerCase()} account`) },
  ];
  return { complete: items.every((i) => i.done), items };
}
