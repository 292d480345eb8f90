/** The four kinds of Panwise user. Office users are the owner and the bookkeeper. */
export const ROLES = ["owner", "baker", "bookkeeper", "buyer"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  baker: "Baker",
  bookkeeper: "Bookkeeper",
  buyer: "Wholesale buyer",
};

/** Which group of screens a role lands in after sign-in. */
export type HomeArea = "buyer" | "baker" | "office";

export function homeAreaFor(role: Role): HomeArea {
  switch (role) {
    case "buyer":
      return "buyer";
    case "baker":
      return "baker";
    case "owner":
    case "bookkeeper":
      return "office";
  }
}

export function isOffice(role: Role): boolean {
  return role === "owner" || role === "bookkeeper";
}
