import { getVtimezoneComponent } from '@touch4it/ical-timezones';

/**
 * The VTIMEZONE of an IANA zone (RFC 5545 §3.6.5), from @touch4it/ical-timezones, with its TZID
 * set to the name asked for: the package answers an alias (UTC) with its canonical zone (Etc/UTC),
 * and every TZID in a feed must match a VTIMEZONE exactly. null for a zone the package lacks: the
 * feed then writes UTC times instead of local ones.
 */
export function vtimezone(zone: string): string | null {
  const component = getVtimezoneComponent(zone);
  if (!component) return null;
  return component.replace(/^TZID:.*$/m, `TZID:${zone}`).replace(/^X-LIC-LOCATION:.*$/m, `X-LIC-LOCATION:${zone}`);
}
