import type { Product, Protocol, ProtocolStep, StepNeed } from './model';
import { DEFAULT_TURNOVER_RULES } from './demo-rules';

/*
 * Demo and test values only (the demo seed stores them as data; engine specs use them as
 * fixtures). Production never imports this module: a site's products and protocols come from
 * its database. Invented; each site sets its own from its product labels and policy.
 * The minutes below are planning aids, not instructions: the disinfectant's label contact time
 * and the facility's infection-prevention policy rule.
 */

/** Demo products: a standard surface wipe and a sporicidal wipe (contact times invented). */
export const DEFAULT_PRODUCTS: readonly Product[] = [
  { key: 'standard', name: 'Standard surface wipe', contactMinutes: 2 },
  { key: 'sporicidal', name: 'Sporicidal wipe', contactMinutes: 4 },
];

const afterClear: StepNeed[] = [{ key: 'clear', dry: false }];

function step(
  key: string,
  label: string,
  handsOnMinutes: number,
  needs: StepNeed[],
  extra: Partial<ProtocolStep> = {},
): ProtocolStep {
  return { key, label, handsOnMinutes, dryMinutes: 0, disinfects: false, needs, ...extra };
}

/** A surface wiped with the product: it waits contact + dry time before it may be used. */
function surface(key: string, label: string, handsOnMinutes: number, dryMinutes: number): ProtocolStep {
  return step(key, label, handsOnMinutes, afterClear, { dryMinutes, disinfects: true });
}

const dryOf = (...keys: string[]): StepNeed[] => keys.map((key) => ({ key, dry: true }));

const clear = (what: string) => step('clear', `Patient out; ${what} off`, 3, []);
const injector = step('injector', 'Contrast injector prep', 3, afterClear, { onlyWithContrast: true });
const hygiene = step('hygiene', 'Gloves off, hand hygiene', 1, [], { afterAllOthers: true });

const workstation = step('workstation', 'Workstation wipe-down', 5, [], { disinfects: true });
const openingInjector = step('injector', 'Contrast injector prep', 3, [], { onlyWithContrast: true });

/** Opening step every default protocol shares: the room made up before the first patient. */
const roomcheck = step('roomcheck', 'Room made up for the first patient', 2, []);

/** Default MR protocol (the product brief's table). */
export const MR_PROTOCOL: Protocol = {
  modality: 'MR',
  steps: [
    clear('coil, pads and linen'),
    surface('bore', 'Bore, from both ends', 4, 4),
    surface('table', 'Table top and rails', 2, 2),
    surface('coils', 'Coil(s) used', 2, 1),
    surface('cushions', 'Cushions and pads', 2, 1),
    surface('comfort', 'Hearing protection and call device', 1, 1),
    surface('touch', 'Counters and door handles', 1, 0),
    step('linen', 'Fresh sheet and pillow', 1, dryOf('table')),
    step('coilset', "Place the next patient's coil", 1, dryOf('table', 'coils')),
    step('cushionset', 'Cushions back', 1, dryOf('cushions')),
    step('covers', 'Fresh hearing-protection covers', 1, dryOf('comfort')),
    injector,
    hygiene,
  ],
  openingSteps: [
    workstation,
    roomcheck,
    openingInjector,
  ],
  rules: DEFAULT_TURNOVER_RULES,
};

/** Default CT protocol: same shape as MR, shorter (CT slots are 10–20 minutes). */
export const CT_PROTOCOL: Protocol = {
  modality: 'CT',
  steps: [
    clear('straps, pads and linen'),
    surface('gantry', 'Gantry opening and face', 2, 1),
    surface('table', 'Table top, head holder and straps', 2, 1),
    surface('touch', 'Counters and door handles', 1, 0),
    step('linen', 'Fresh sheet and pillow', 1, dryOf('table')),
    injector,
    hygiene,
  ],
  openingSteps: [
    workstation,
    roomcheck,
    openingInjector,
  ],
  rules: DEFAULT_TURNOVER_RULES,
};

/** For any modality without its own protocol (US, DX, NM, …). */
export const GENERIC_PROTOCOL: Protocol = {
  modality: '*',
  steps: [
    clear('linen'),
    surface('table', 'Table or couch', 2, 1),
    surface('touch', 'Counters and door handles', 1, 0),
    step('linen', 'Fresh sheet and pillow', 1, dryOf('table')),
    hygiene,
  ],
  openingSteps: [workstation, roomcheck],
  rules: DEFAULT_TURNOVER_RULES,
};

/** Default protocols by DICOM modality code; `*` is the fallback. */
export const DEFAULT_PROTOCOLS: Readonly<Record<string, Protocol>> = {
  MR: MR_PROTOCOL,
  CT: CT_PROTOCOL,
  '*': GENERIC_PROTOCOL,
};

/** The demo's whole setup, as a day plan's input carries a site's (spread it into a fixture input). */
export const DEMO_SETUP: { products: readonly Product[]; protocols: Readonly<Record<string, Protocol>> } = {
  products: DEFAULT_PRODUCTS,
  protocols: DEFAULT_PROTOCOLS,
};

export { DEFAULT_TURNOVER_RULES };
