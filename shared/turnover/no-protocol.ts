/**
 * Said for a room whose modality has no protocol (and no `*` fallback): the plan shows no
 * numbers for it rather than numbers from invented defaults.
 *
 * @example
 * NO_PROTOCOL_MESSAGE('CT'); // 'No protocol for CT: set one up in Setup'
 */
export function NO_PROTOCOL_MESSAGE(modality: string): string {
  return `No protocol for ${modality}: set one up in Setup`;
}
