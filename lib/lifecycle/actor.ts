import type { Channel } from "@/db/queries/audit";
import type { Role } from "@/lib/auth/roles";

/** Who moves a month through its life cycle (or signs its statement), as the service records them. */
export interface LifecycleActor {
  organisationId: string;
  organisationName: string;
  userId: string;
  name: string;
  email: string;
  roles: Role[];
  channel?: Channel;
}
