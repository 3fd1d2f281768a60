/**
 * Types of the turnover engine. Pure data: no framework, no Node-only API, so the server and
 * the Angular client share one engine (and one answer).
 */

/** Isolation category of the leaving exam: CDC categories plus the trade's "enteric" (spore formers). */
export type Precaution = 'none' | 'contact' | 'enteric' | 'droplet' | 'airborne';
export const PRECAUTIONS: readonly Precaution[] = ['none', 'contact', 'enteric', 'droplet', 'airborne'];

/** How the leaving patient moves; a stretcher takes longer to clear than a walking patient. */
export type Mobility = 'ambulatory' | 'wheelchair' | 'stretcher';
export const MOBILITIES: readonly Mobility[] = ['ambulatory', 'wheelchair', 'stretcher'];

/** Verdict of a gap between two slots. */
export type Verdict = 'fits' | 'snug' | 'short' | 'overlap';
export const VERDICTS: readonly Verdict[] = ['fits', 'snug', 'short', 'overlap'];

/** A disinfectant product; contact time is the label's wet time. */
export interface Product {
  key: string;
  name: string;
  contactMinutes: number;
  /**
   * How long one application stays wet on a surface (label or a site's test). When it dries
   * before the contact time, the step is re-wetted: see {@link applicationsOf}.
   */
  staysWetMinutes?: number | null;
}

/** When a step is part of a turnover at all; every condition given must hold. */
export interface StepCondition {
  /** The arriving exam has contrast. */
  contrast?: boolean;
  /** The coil changes between the leaving and arriving exam. */
  coilChange?: boolean;
  /** The leaving patient moved in one of these ways. */
  mobility?: readonly Mobility[];
  /** The leaving exam was under one of these precautions. */
  precaution?: readonly Precaution[];
}

/** One need of a step: the other step done, or done and dry. */
export interface StepNeed {
  key: string;
  dry: boolean;
}

/** A step of a protocol, as an admin sets it up. */
export interface ProtocolStep {
  key: string;
  label: string;
  handsOnMinutes: number;
  /** Dry time after the step; a disinfecting step also waits its product's contact time first. */
  dryMinutes: number;
  disinfects: boolean;
  needs: StepNeed[];
  /** Only part of the turnover when the arriving exam has contrast (e.g. injector prep). */
  onlyWithContrast?: boolean;
  /** Needs every other step's hands-on done (e.g. gloves off and hand hygiene). */
  afterAllOthers?: boolean;
  /** Only part of the turnover when these hold (the opening has no leaving exam: no coil change, mobility or precaution). */
  onlyWhen?: StepCondition;
  /** This step's product (a disinfecting step); else the precaution's, else the rules' default. */
  productKey?: string | null;
}

/** A modality's protocol: the steps between two patients and the steps that open the day. */
export interface Protocol {
  modality: string;
  steps: ProtocolStep[];
  openingSteps: ProtocolStep[];
  /** This protocol's precaution, mobility and coil-change rules (each modality may differ). */
  rules?: TurnoverRules;
  /** The stored version it is (a site's protocols are versioned); absent for fixtures. */
  id?: number;
  version?: number;
  /** `YYYY-MM-DD`: the first day this version applies. */
  effectiveFrom?: string;
}

/** What the engine needs to know about a room. */
export interface TurnoverRoom {
  staff: number;
  airChangesPerHour: number;
  modality: string;
}

/** What the engine needs to know about an exam. */
export interface TurnoverExam {
  coil?: string | null;
  precaution: Precaution;
  mobility: Mobility;
  contrast: boolean;
}

/** Minutes added to (or set on) a step's hands-on time, keyed by the step's key. */
export interface StepAdjustment {
  step: string;
  addMinutes?: number;
  setMinutes?: number;
}

/** What a precaution of the leaving exam changes in the turnover. */
export interface PrecautionRule {
  /** Protective equipment put on first: a `don` step every first step of the protocol needs. */
  don?: { label: string; handsOnMinutes: number } | null;
  adjust: StepAdjustment[];
  /** Product for every disinfecting step (e.g. sporicidal); else the rules' default product. */
  productKey?: string;
  /** The room stays closed until the air is exchanged (airborne precautions). */
  airHold: boolean;
}

/** The rules that turn a protocol into a gap's steps; data, so a site can change them. */
export interface TurnoverRules {
  /** Product of disinfecting steps that name none; null: every disinfecting step names its own. */
  defaultProductKey: string | null;
  precaution: Record<Precaution, PrecautionRule>;
  mobility: Record<Mobility, StepAdjustment[]>;
  /** Applied when the leaving and arriving coils differ. */
  coilChange: StepAdjustment[];
}

/** A step of one concrete turnover: minutes resolved, product chosen. */
export interface TurnoverStep {
  key: string;
  label: string;
  handsOnMinutes: number;
  /** Product contact time (when it disinfects) plus dry time. */
  waitMinutes: number;
  needs: StepNeed[];
  productKey: string | null;
  /** Applications of the product when one dries before its contact time (hands-on is multiplied); absent: 1. */
  applications?: number;
}

/** The steps of one gap with who does them and how long the air must clear. */
export interface StepSet {
  steps: TurnoverStep[];
  staff: number;
  airHoldMinutes: number;
}

/** A step as the solver takes it (a {@link TurnoverStep} is one). */
export interface SolverStep {
  key: string;
  label: string;
  handsOnMinutes: number;
  waitMinutes: number;
  needs: StepNeed[];
}

/** A step placed in time: minutes from the leaving exam's end (or the room's opening). */
export interface ScheduledStep {
  key: string;
  label: string;
  start: number;
  end: number;
  dryAt: number;
  /** 0-based index of the person doing it. */
  person: number;
}

/** The solver's answer. */
export interface TurnoverSchedule {
  /** Latest hands-on end or dry-at time: the room is ready then (air hold not included). */
  requiredMinutes: number;
  steps: ScheduledStep[];
}

/** A whole gap's turnover: the schedule plus the air hold. */
export interface TurnoverPlan {
  /** max(schedule, air hold). */
  requiredMinutes: number;
  scheduleMinutes: number;
  airHoldMinutes: number;
  staff: number;
  steps: ScheduledStep[];
}
