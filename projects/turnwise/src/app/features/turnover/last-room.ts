/** Where the last room shown is kept, so a tablet mounted in a room opens on that room. */
export const LAST_ROOM_KEY = 'turnwise.turnover.room';

/** Keeps the room this device last showed. */
export function rememberRoom(roomId: number): void {
  try {
    localStorage.setItem(LAST_ROOM_KEY, String(roomId));
  } catch {
    // Storage can be off (private mode, policy); the room is then picked again next time.
  }
}

/** The room this device last showed, as stored (a room id), or null. */
export function readLastRoom(): string | null {
  try {
    return localStorage.getItem(LAST_ROOM_KEY);
  } catch {
    // Storage can be off (private mode, policy): the first room is a fine start.
    return null;
  }
}
