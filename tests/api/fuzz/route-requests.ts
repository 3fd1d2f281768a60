import fc from 'fast-check';
import { ROLES, type Role } from '../../../shared/api/auth';
import type { RouteCase } from '../route-table';
import type { RouteShape } from './route-shapes';
import { pathSegment, queryString, type Strangeness } from './values';

/** A route of the role matrix as its shape is keyed: `method path`. */
export const routeKey = (route: RouteCase) => `${route.method} ${route.path}`;

/** The clients (signed in by role, or none) the route lets through. */
export function rolesAllowed(route: RouteCase): (Role | 'anonymous')[] {
  if (route.allowed === 'public') return ['anonymous', ...ROLES];
  if (route.allowed === 'signed-in') return [...ROLES];
  return route.allowed;
}

/** The route's URL with each `:param` replaced, and the query (the table's fixed one first). */
export function urlArbitrary(route: RouteCase, shape: RouteShape, level: Strangeness): fc.Arbitrary<string> {
  const [pathname, fixedQuery] = route.path.split('?') as [string, string | undefined];
  const names = [...pathname.matchAll(/:(\w+)/g)].map((m) => m[1]!);
  const segments = fc.tuple(...names.map((name) => pathSegment(shape.params[name] ?? fc.string(), level)));
  return fc.tuple(segments, queryString(shape.query ?? {}, level)).map(([values, query]) => {
    let i = 0;
    const path = pathname.replace(/:(\w+)/g, () => values[i++]!);
    const joined = [fixedQuery, query.replace(/^\?/, '')].filter(Boolean).join('&');
    return joined ? `${path}?${joined}` : path;
  });
}

