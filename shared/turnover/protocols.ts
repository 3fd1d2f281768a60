import type { Product, Protocol } from './model';

/**
 * The protocol for a modality: the site's own, else its `*` fallback, else null (the room gets
 * no numbers: nothing is computed from invented defaults).
 *
 * @example
 * protocolFor('mr', { MR: mr, '*': other })?.modality; // 'MR'
 * protocolFor('US', { MR: mr }); // null
 */
export function protocolFor(modality: string, protocols: Readonly<Record<string, Protocol>> | undefined): Protocol | null {
  if (!protocols) return null;
  return protocols[modality.toUpperCase()] ?? protocols[modality] ?? protocols['*'] ?? null;
}

/**
 * Applications one disinfecting step takes with a product: the surface must stay wet for the
 * whole label contact time, so a product that dries first is re-applied,
 * ⌈contact ÷ stays-wet⌉ times (derived; common practice, no source). 1 when it stays wet long
 * enough or its stays-wet time is not known.
 *
 * @example
 * applicationsOf({ key: 'q', name: 'Quick wipe', contactMinutes: 3, staysWetMinutes: 1.25 }); // 3
 */
export function applicationsOf(product: Pick<Product, 'contactMinutes' | 'staysWetMinutes'>): number {
  const wet = product.staysWetMinutes;
  if (wet === undefined || wet === null || !(wet > 0) || wet >= product.contactMinutes) return 1;
  // a tolerance, so 3 ÷ 1.5 is 2 and not 2.0000000000000004 rounded up
  return Math.ceil(product.contactMinutes / wet - 1e-9);
}
