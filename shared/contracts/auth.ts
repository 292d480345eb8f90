/** GET /api/auth/invitations/:token: who an invitation link is for, so the set-password screen can say so. */
import type { Role } from "../roles";

export interface InvitationPreviewDto {
  email: string;
  role: Role;
  name: string | null;
}
