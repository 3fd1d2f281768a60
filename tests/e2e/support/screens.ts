import Module from 'node:module';
import path from 'node:path';
import type { Role } from '../../../shared/api/auth';

// The expected navigation comes from the client's own table (roles.ts), so the browser test checks
// that the rendered shell matches it rather than a second hand-kept copy. roles.ts imports
// `@shared/...`, an alias only the client's tsconfig knows; tsx runs with the root tsconfig, so
// the alias is mapped here before the module is required. It is required, not imported, so
// `tsc -p tsconfig.server.json` does not follow it into client code it cannot resolve.
const SHARED_DIR = path.resolve(__dirname, '..', '..', '..', 'shared');
const ROLES_MODULE = path.resolve(__dirname, '..', '..', '..', 'projects', 'turnwise', 'src', 'app', 'core', 'auth', 'roles');

/** The parts of the client's Screen this test relies on. */
export interface ClientScreen {
  path: string;
  label: string;
}

interface ClientRoles {
  screensFor(role: Role): ClientScreen[];
  homeFor(role: Role): string;
  roleLabel(role: Role): string;
}

type Resolver = (request: string, ...rest: unknown[]) => string;
const loader = Module as unknown as { _resolveFilename: Resolver };

function requireClientRoles(): ClientRoles {
  const original = loader._resolveFilename;
  loader._resolveFilename = function (this: unknown, request: string, ...rest: unknown[]) {
    const mapped = request.startsWith('@shared/') ? path.join(SHARED_DIR, request.slice('@shared/'.length)) : request;
    return original.call(this, mapped, ...rest);
  };
  try {
    return require(ROLES_MODULE) as ClientRoles;
  } finally {
    loader._resolveFilename = original;
  }
}

const clientRoles = requireClientRoles();

/** The screens the client offers `role`, in navigation order (client's roles.ts). */
export const screensFor = (role: Role): ClientScreen[] => clientRoles.screensFor(role);
/** Where `role` lands after signing in, e.g. `/turnover` for a technologist. */
export const homeFor = (role: Role): string => clientRoles.homeFor(role);
/** The role as the toolbar shows it, e.g. "Charge technologist". */
export const roleLabel = (role: Role): string => clientRoles.roleLabel(role);
