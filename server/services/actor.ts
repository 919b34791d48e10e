/** Who is doing something, as services need it for checks and for the trail. Built by handlers. */
export interface Actor {
  /** null for anonymous requests (sign-in). */
  userId: number | null;
  /** Printed name at the time of the action. */
  name: string;
  /** Client IP as Express sees it (honours `trust proxy`). */
  clientAddress: string;
}
