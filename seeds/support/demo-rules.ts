import type { Knex } from 'knex';
import { protocolBodySchema, type ProtocolBody, type ProtocolBodyInput } from '../../shared/api/protocols';
import { DEFAULT_PRODUCTS, DEFAULT_PROTOCOLS } from '../../shared/turnover/demo-protocols';
import type { Protocol, ProtocolStep, StepAdjustment } from '../../shared/turnover/model';

/**
 * The demo's products and protocols, stored as data like any site's (invented values, from
 * shared/turnover/demo-protocols.ts, which only seeds and tests import). Effective from long
 * before any demo day, so every seeded day (and the demo history) has them.
 */
export const DEMO_RULES_EFFECTIVE_FROM = '2020-01-01';

const DEMO_PRODUCT_ROWS: Record<string, { kind: string; registration: string; notes: string }> = {
  standard: { kind: 'standard', registration: 'DEMO-0001', notes: 'Invented demo product: contact time from no real label.' },
  sporicidal: { kind: 'sporicidal', registration: 'DEMO-0002', notes: 'Invented demo product: contact time from no real label.' },
};

function stepInput(s: ProtocolStep, productIds: Map<string, number>): ProtocolBodyInput['steps'][number] {
  return {
    key: s.key,
    label: s.label,
    handsOnMinutes: s.handsOnMinutes,
    dryMinutes: s.dryMinutes,
    disinfects: s.disinfects,
    productId: s.productKey ? productIds.get(s.productKey)! : null,
    needs: s.needs.map((n) => ({ key: n.key, dry: n.dry })),
    onlyWhen: { ...(s.onlyWithContrast ? { contrast: true } : {}), ...(s.onlyWhen ?? {}) } as never,
    afterAllOthers: s.afterAllOthers ?? false,
  };
}

const adjustments = (list: readonly StepAdjustment[]) => list.map((a) => ({ ...a }));

/** A demo protocol (with its rules) as a stored body, its product keys turned into the seeded ids. */
export function demoBody(protocol: Protocol, productIds: Map<string, number>): ProtocolBody {
  const rules = protocol.rules!;
  const id = (key: string | null | undefined) => (key ? productIds.get(key)! : null);
  const level = (name: 'contact' | 'enteric' | 'droplet' | 'airborne') => {
    const r = rules.precaution[name];
    return { don: r.don ?? null, adjust: adjustments(r.adjust), productId: id(r.productKey), airHold: r.airHold };
  };
  return protocolBodySchema.parse({
    steps: protocol.steps.map((s) => stepInput(s, productIds)),
    openingSteps: protocol.openingSteps.map((s) => stepInput(s, productIds)),
    defaultProductId: id(rules.defaultProductKey),
    precautions: { contact: level('contact'), enteric: level('enteric'), droplet: level('droplet'), airborne: level('airborne') },
    mobility: { ambulatory: adjustments(rules.mobility.ambulatory), wheelchair: adjustments(rules.mobility.wheelchair), stretcher: adjustments(rules.mobility.stretcher) },
    coilChange: adjustments(rules.coilChange),
  });
}

/** Idempotent: products by name, and version 1 of each demo modality only when it has none. */
export async function seedDemoRules(knex: Knex, now: Date): Promise<void> {
  const stamp = now.toISOString();
  const productIds = new Map<string, number>();
  for (const product of DEFAULT_PRODUCTS) {
    const existing = await knex('products').where({ name: product.name }).whereNull('retired_at').first('id');
    if (existing) {
      productIds.set(product.key, existing.id);
      continue;
    }
    const [{ id }] = await knex('products').insert({
      name: product.name,
      contact_minutes: product.contactMinutes,
      stays_wet_minutes: product.staysWetMinutes ?? null,
      ...DEMO_PRODUCT_ROWS[product.key],
      created_at: stamp,
      updated_at: stamp,
    }).returning('id');
    productIds.set(product.key, id as number);
  }
  for (const [modality, protocol] of Object.entries(DEFAULT_PROTOCOLS)) {
    if (await knex('protocol_versions').where({ modality }).first('id')) continue;
    await knex('protocol_versions').insert({
      modality,
      version: 1,
      effective_from: DEMO_RULES_EFFECTIVE_FROM,
      body: JSON.stringify(demoBody(protocol, productIds)),
      created_by: null,
      created_at: stamp,
      note: 'Demo protocol (invented values).',
    });
  }
}
