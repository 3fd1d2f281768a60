import type { PrecautionRule, TurnoverRules } from './model';

/*
 * Demo and test values only, never imported in production (see demo-protocols.ts). Invented; each site sets its own from its product labels and policy.
 * Rules name steps by key (`don`, `clear`, `coilset`, `hygiene`); a protocol without such a
 * step is simply not changed by that rule, so admins can edit protocols freely.
 */

const contactRule: PrecautionRule = {
  don: { label: 'Gown and gloves on', handsOnMinutes: 1 },
  adjust: [
    { step: 'clear', addMinutes: 1 }, // linen into an isolation bag
    { step: 'hygiene', setMinutes: 2 },
  ],
  airHold: false,
};

/** The product brief's rules for precaution, mobility and coil change. */
export const DEFAULT_TURNOVER_RULES: TurnoverRules = {
  defaultProductKey: 'standard',
  precaution: {
    none: { adjust: [], airHold: false },
    contact: contactRule,
    enteric: {
      ...contactRule,
      // Alcohol does not kill spores: soap-and-water wash, sporicidal product on every surface.
      adjust: [
        { step: 'clear', addMinutes: 1 },
        { step: 'hygiene', setMinutes: 3 },
      ],
      productKey: 'sporicidal',
    },
    droplet: {
      don: { label: 'Mask and gloves on', handsOnMinutes: 1 },
      adjust: [{ step: 'hygiene', setMinutes: 2 }],
      airHold: false,
    },
    airborne: {
      don: { label: 'Respirator and gloves on', handsOnMinutes: 1 },
      adjust: [{ step: 'hygiene', setMinutes: 2 }],
      airHold: true,
    },
  },
  mobility: {
    ambulatory: [],
    wheelchair: [{ step: 'clear', addMinutes: 2 }],
    stretcher: [{ step: 'clear', addMinutes: 4 }],
  },
  coilChange: [{ step: 'coilset', addMinutes: 2 }],
};
