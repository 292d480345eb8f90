/**
 * The ordering screens' shared pieces, each in its own file; this module keeps the one import path other
 * screens (products, pricing, production, accounts) use for them.
 */
export { useMoney } from "../../ordering/useMoney";
export { dayStatus } from "../../ordering/dayStatus";
export { ProductPhoto } from "./ProductPhoto";
export { AllergenCaution, AllergenChips } from "./Allergens";
export { OrderStatusBadge, buyerStatusLabel } from "./OrderStatusBadge";
export { CutoffCountdown, type CutoffCountdownProps } from "./CutoffCountdown";
