import type { Role } from '@shared/schemas/user';

/** The person a request is made for, as far as the rules care: who they are and their role. */
export interface Actor {
  id: number;
  role: Role;
}

/** Organisers and coordinators read everyone's records; volunteers only their own. */
export const readsAll = (actor: Actor): boolean => actor.role !== 'volunteer';

/**
 * Whether this person may see a record owned by `ownerId`. Someone else's record that they may not
 * see is answered as "not found", never "forbidden", so its existence is not given away.
 */
export const maySee = (actor: Actor, ownerId: number): boolean => ownerId === actor.id || readsAll(actor);
