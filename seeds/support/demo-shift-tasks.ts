import type { Knex } from 'knex';
import { addDefaultShiftTasks } from '../../server/services/shift-tasks';

/** Our default shift tasks for every room set up so far; a room's existing tasks are kept. */
export async function seedShiftTasks(knex: Knex, now: Date): Promise<void> {
  const rooms: { id: number; opens_at: string; closes_at: string }[] = await knex('rooms').select('id', 'opens_at', 'closes_at');
  for (const room of rooms) await addDefaultShiftTasks(knex, room.id, { opensAt: room.opens_at, closesAt: room.closes_at }, now);
}
