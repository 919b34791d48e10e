/** Who is doing something, as services need it for checks and for the trail. Built by handlers. */
export interface Actor {
  /** null for anonymous requests (sign-in). */
  userId: number | null;
  /** Printed name at the time of the action. */
  name: string;
  /** Client IP as Express sees it (honours `trust proxy`). */
  clientAddress: string;
  /**
   * True when this person already completed a signing with both signature components
   * (username and password) in the current continuous session; then a signing needs the
   * password only (21 CFR 11.200(a)(1)(ii)). Absent outside a web session.
   */
  signedFullyInSession?: boolean;
}
