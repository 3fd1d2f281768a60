import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { planTurnover, protocolFor, type Mobility, type Precaution, type TurnoverExam } from '../../shared/turnover';
import { DEFAULT_PRODUCTS, DEFAULT_PROTOCOLS } from '../../shared/turnover/demo-protocols';
import { readSettings } from '../../server/services/settings';

/** How the demo wants the gap before an exam to come out. */
type Intent = 'fits' | 'snug' | 'short' | 'overlap';
type Slot = [intent: Intent, minutes: number, procedure: string, coil: string, precaution: Precaution, mobility: Mobility, contrast: boolean, notes?: string];

/**
 * An invented day list, per room, with the verdict each gap should show: mostly `fits`, a few
 * `snug` and `short`, one `overlap`, one exam of each precaution, coil changes, contrast and a
 * stretcher patient. Start times are derived with the turnover engine so the intents hold
 * whatever the protocol defaults are. Slot lengths follow common practice (no source).
 */
export const DEMO_DAY: Record<string, { firstAt: string; slots: Slot[] }> = {
  'MR 1': {
    firstAt: '07:15',
    slots: [
      ['fits', 30, 'MR knee without contrast', 'knee', 'none', 'ambulatory', false],
      ['fits', 45, 'MR brain with contrast', 'head', 'none', 'ambulatory', true],
      ['short', 30, 'MR knee without contrast', 'knee', 'none', 'wheelchair', false],
      ['fits', 40, 'MR lumbar spine without contrast', 'spine', 'none', 'ambulatory', false],
      ['fits', 45, 'MR shoulder without contrast', 'shoulder', 'contact', 'ambulatory', false, 'Contact precautions'],
      ['snug', 30, 'MR ankle without contrast', 'foot-ankle', 'none', 'ambulatory', false],
      ['fits', 45, 'MR brain without contrast', 'head', 'none', 'stretcher', false, 'Inpatient; transport booked'],
      ['fits', 60, 'MR chest with contrast', 'body', 'airborne', 'wheelchair', true, 'Airborne precautions'],
      ['fits', 30, 'MR cervical spine without contrast', 'spine', 'none', 'ambulatory', false],
    ],
  },
  'MR 2': {
    firstAt: '07:20',
    slots: [
      ['fits', 45, 'MR abdomen with contrast', 'body', 'none', 'ambulatory', true],
      ['fits', 30, 'MR knee without contrast', 'knee', 'none', 'ambulatory', false],
      ['fits', 40, 'MR thoracic spine without contrast', 'spine', 'enteric', 'ambulatory', false, 'Enteric precautions'],
      ['short', 30, 'MR hip without contrast', 'body', 'none', 'ambulatory', false],
      ['fits', 45, 'MR pelvis with contrast', 'body', 'none', 'stretcher', true],
      ['fits', 30, 'MR wrist without contrast', 'wrist', 'none', 'ambulatory', false],
      ['snug', 45, 'MR brain with contrast', 'head', 'none', 'ambulatory', true],
      ['fits', 45, 'MR liver with contrast', 'body', 'none', 'ambulatory', true],
      ['fits', 30, 'MR knee without contrast', 'knee', 'none', 'ambulatory', false],
    ],
  },
  'MR 3': {
    firstAt: '07:20',
    slots: [
      ['fits', 30, 'MR brain without contrast', 'head', 'none', 'ambulatory', false],
      ['fits', 40, 'MR lumbar spine without contrast', 'spine', 'droplet', 'wheelchair', false, 'Droplet precautions'],
      ['fits', 45, 'MR brain with contrast', 'head', 'none', 'ambulatory', true],
      ['fits', 30, 'MR knee without contrast', 'knee', 'none', 'ambulatory', false],
      ['snug', 60, 'MR prostate with contrast', 'body', 'none', 'ambulatory', true],
      ['fits', 30, 'MR shoulder without contrast', 'shoulder', 'none', 'ambulatory', false],
      ['fits', 45, 'MR internal auditory canals with contrast', 'head', 'none', 'ambulatory', true],
      ['short', 30, 'MR ankle without contrast', 'foot-ankle', 'none', 'ambulatory', false],
      ['fits', 45, 'MR cervical spine without contrast', 'spine', 'none', 'ambulatory', false],
    ],
  },
  'CT 1': {
    firstAt: '07:15',
    slots: [
      ['fits', 15, 'CT head without contrast', '', 'none', 'ambulatory', false],
      ['fits', 20, 'CT chest with contrast', '', 'none', 'ambulatory', true],
      ['fits', 15, 'CT sinus without contrast', '', 'none', 'ambulatory', false],
      ['fits', 20, 'CT abdomen and pelvis with contrast', '', 'none', 'stretcher', true],
      ['snug', 15, 'CT head without contrast', '', 'none', 'wheelchair', false],
      ['fits', 25, 'CT angiography of the head and neck', '', 'none', 'ambulatory', true],
      ['fits', 15, 'CT chest without contrast', '', 'contact', 'ambulatory', false, 'Contact precautions'],
      ['fits', 15, 'CT head without contrast', '', 'none', 'ambulatory', false],
      ['overlap', 20, 'CT abdomen with contrast', '', 'none', 'ambulatory', true, 'Double-booked'],
      ['fits', 15, 'CT spine without contrast', '', 'none', 'ambulatory', false],
    ],
  },
};

interface RoomRow {
  id: number;
  name: string;
  modality: string;
  staff: number;
  air_changes_per_hour: number;
}

/** Minutes between one exam's end and the next start that give the intended verdict. */
function spacing(intent: Intent, required: number, snugMargin: number): number {
  switch (intent) {
    case 'fits':
      return required + snugMargin + 2;
    case 'snug':
      return required + Math.max(0, snugMargin - 1);
    case 'short':
      return Math.max(0, required - 4);
    case 'overlap':
      return -5;
  }
}

/** Seeds today's invented list (today in the site's zone) unless the day already has one. */
export async function seedDemoDay(knex: Knex, now: Date): Promise<void> {
  const { timezone, snugMarginMinutes } = await readSettings(knex);
  const today = DateTime.fromJSDate(now).setZone(timezone).toISODate()!;
  if (await knex('exams').where({ day: today }).first()) return;
  const rooms: RoomRow[] = await knex('rooms').select('id', 'name', 'modality', 'staff', 'air_changes_per_hour');
  const stamp = now.toISOString();
  const rows: Record<string, unknown>[] = [];
  for (const room of rooms) {
    const plan = DEMO_DAY[room.name];
    if (!plan) continue;
    const turnoverRoom = { staff: room.staff, airChangesPerHour: room.air_changes_per_hour, modality: room.modality };
    let start = DateTime.fromISO(`${today}T${plan.firstAt}`, { zone: timezone });
    let previous: (TurnoverExam & { minutes: number }) | null = null;
    for (const [intent, minutes, procedure, coil, precaution, mobility, contrast, notes] of plan.slots) {
      const exam = { coil: coil || null, precaution, mobility, contrast, minutes };
      if (previous) {
        // the demo's own protocols (the same values the demo seed stores as data)
        const protocol = protocolFor(room.modality, DEFAULT_PROTOCOLS)!;
        const required = planTurnover({ leaving: previous, arriving: exam, room: turnoverRoom, protocol, products: DEFAULT_PRODUCTS }).requiredMinutes;
        start = start.plus({ minutes: previous.minutes + spacing(intent, required, snugMarginMinutes) });
        // a comfortable slot lands on the booking grid of 5 minutes, as a scheduler would book it
        if (intent === 'fits') start = start.plus({ minutes: (5 - (start.minute % 5)) % 5 });
      }
      rows.push({
        day: today,
        accession: `TWD-${today.replaceAll('-', '')}-${String(rows.length + 1).padStart(3, '0')}`,
        room_id: room.id,
        start_at: start.toISO({ suppressMilliseconds: true }),
        start_ms: start.toMillis(),
        duration_minutes: minutes,
        procedure,
        coil: exam.coil,
        precaution,
        mobility,
        contrast,
        notes: notes ?? null,
        version: 1,
        updated_at: stamp,
      });
      previous = exam;
    }
  }
  await knex.batchInsert('exams', rows, 100);
}
