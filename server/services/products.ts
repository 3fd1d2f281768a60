import type { Knex } from 'knex';
import {
  SHORT_CONTACT_CAUTION,
  SHORT_CONTACT_MINUTES,
  type ProductAnswer,
  type ProductFields,
  type ProductView,
  type SaveWarning,
} from '../../shared/api/protocols';
import { NotFoundError, Refusal, ValidationError } from '../errors';
import { changedFields, recordAudit, type Actor } from './audit';
import { productUse, readSnapshot, toProductView, type ProductRow } from './site-setup';
import { siteToday } from './site-today';

/** The caution a contact time under 1 minute carries (saved anyway: the label rules). */
export function productWarnings(fields: Pick<ProductFields, 'contactMinutes'>): SaveWarning[] {
  return fields.contactMinutes < SHORT_CONTACT_MINUTES ? [{ field: 'contactMinutes', message: SHORT_CONTACT_CAUTION }] : [];
}

export async function listProducts(db: Knex, now: Date): Promise<ProductView[]> {
  const [snapshot, today] = await Promise.all([readSnapshot(db), siteToday(db, now)]);
  const use = productUse(snapshot, today);
  return [...snapshot.products]
    .sort((a, b) => Number(a.retired_at !== null) - Number(b.retired_at !== null) || a.name.localeCompare(b.name))
    .map((row) => toProductView(row, use.get(row.id) ?? []));
}

async function getProduct(db: Knex, id: number, now: Date): Promise<ProductView> {
  const product = (await listProducts(db, now)).find((p) => p.id === id);
  if (!product) throw new NotFoundError(`No product ${id}.`);
  return product;
}

function columns(fields: ProductFields) {
  return {
    name: fields.name,
    kind: fields.kind,
    contact_minutes: fields.contactMinutes,
    stays_wet_minutes: fields.staysWetMinutes,
    registration: fields.registration,
    notes: fields.notes,
  };
}

function audited(p: ProductView | ProductFields) {
  return { name: p.name, kind: p.kind, contactMinutes: p.contactMinutes, staysWetMinutes: p.staysWetMinutes, registration: p.registration, notes: p.notes };
}

/** An active product of the same name (any case) is a 422 on the name. */
async function refuseDuplicateName(db: Knex, name: string, exceptId: number | null): Promise<void> {
  const q = db('products').whereRaw('lower(name) = lower(?)', [name]).whereNull('retired_at');
  if (exceptId !== null) q.whereNot({ id: exceptId });
  if (await q.first('id')) {
    throw new ValidationError(`A product named "${name}" already exists.`, { problems: [{ field: 'name', message: 'an active product already has this name' }] });
  }
}

export async function createProduct(db: Knex, fields: ProductFields, by: Actor, now: Date): Promise<ProductAnswer> {
  return db.transaction(async (trx) => {
    await refuseDuplicateName(trx, fields.name, null);
    const stamp = now.toISOString();
    const [{ id }] = await trx('products').insert({ ...columns(fields), created_at: stamp, updated_at: stamp }).returning('id');
    const product = await getProduct(trx, id as number, now);
    await recordAudit(trx, by, { area: 'product', action: 'created', subject: product.name, before: null, after: audited(product) }, now);
    return { product, warnings: productWarnings(fields) };
  });
}

/** A change applies to every plan from now on that uses the product (past turnovers keep their ticks' times). */
export async function updateProduct(db: Knex, id: number, fields: ProductFields, by: Actor, now: Date): Promise<ProductAnswer> {
  return db.transaction(async (trx) => {
    const before = await getProduct(trx, id, now);
    if (before.retired) throw new NotFoundError(`No active product ${id}.`);
    await refuseDuplicateName(trx, fields.name, id);
    await trx('products').where({ id }).update({ ...columns(fields), updated_at: now.toISOString() });
    const product = await getProduct(trx, id, now);
    const diff = changedFields(audited(before), audited(product));
    if (Object.keys(diff.after).length > 0) await recordAudit(trx, by, { area: 'product', action: 'changed', subject: product.name, ...diff }, now);
    return { product, warnings: productWarnings(fields) };
  });
}

/** Retiring a product a current or future protocol version uses is refused (409 naming the modalities). */
export async function retireProduct(db: Knex, id: number, by: Actor, now: Date): Promise<ProductAnswer> {
  return db.transaction(async (trx) => {
    const before = await getProduct(trx, id, now);
    if (before.retired) return { product: before, warnings: [] };
    if (before.usedBy.length > 0) {
      const names = before.usedBy.map((m) => (m === '*' ? 'the fallback (*)' : m)).join(', ');
      throw new Refusal('product_in_use', `${before.name} is used by the protocol for ${names}; choose another product there first.`, { modalities: before.usedBy });
    }
    await trx('products').where({ id }).update({ retired_at: now.toISOString(), updated_at: now.toISOString() });
    await recordAudit(trx, by, { area: 'product', action: 'retired', subject: before.name, before: { retired: false }, after: { retired: true } }, now);
    return { product: await getProduct(trx, id, now), warnings: [] };
  });
}

export type { ProductRow };
