import { ROLE_LABELS, ROLES, type Role } from "../../../shared/roles";
import type { Choice } from "../../ui/ChoiceGroup";

export const ROLE_HINTS: Record<Role, string> = {
  owner: "Runs Panwise: people, accounts and everything else.",
  baker: "Sees the bake day.",
  bookkeeper: "Issues and sends invoices, records payments, reconciles card payouts; sees orders and customer accounts; can't change people.",
  buyer: "Orders for one wholesale account (a café, restaurant or shop).",
};

export const ROLE_CHOICES: Choice<Role>[] = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r], hint: ROLE_HINTS[r] }));
