import { homeAreaFor, type HomeArea, type Role } from "../../shared/roles";

/** The URL of each area's home. */
export const AREA_HOME: Record<HomeArea, "/buyer" | "/bake" | "/office"> = {
  buyer: "/buyer",
  baker: "/bake",
  office: "/office",
};

export function homePathFor(role: Role): "/buyer" | "/bake" | "/office" {
  return AREA_HOME[homeAreaFor(role)];
}
