import type { Hl7AckCode } from '@shared/api/hl7';

/** MSA-1 acknowledgment codes (HL7 v2 table 0008, original mode) in the words the log shows beside them. */
export const ACK_WORDS: Readonly<Record<Hl7AckCode, string>> = {
  AA: 'applied',
  AE: 'refused',
  AR: 'rejected, unreadable',
};

/** Each code's own icon, so a refusal is never told by colour alone. */
export const ACK_ICONS: Readonly<Record<Hl7AckCode, string>> = {
  AA: 'check_circle',
  AE: 'warning',
  AR: 'error',
};
