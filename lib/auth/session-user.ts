import type { Role } from "./roles";

/** Who is asking: loaded fresh from the database on every request, so role changes and deactivation apply at once. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  roles: Role[];
}
