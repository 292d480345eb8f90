import { z } from "zod";
import { readText } from "../../forms/textSchemas";
import { accountDeliverySchema } from "../../../shared/schemas/calendar";
import { parseMoney, toDecimal } from "../../../shared/money";
import type { AccountDeliveryDto } from "../../api/delivery";
import type { Weekday } from "../../../shared/calendar";

/** The delivery terms form's inputs: every delivery day or some, the minimum as typed, the price list's id or "none". */
export interface DeliveryValues {
  everyDay: boolean;
  days: Weekday[];
  minimum: string;
  priceListId: string;
}

export const DELIVERY_FIELDS = ["routeWeekdays", "minimumOrderCents", "priceListId"] as const;

export function deliveryValues(d: AccountDeliveryDto, bakeryDays: Weekday[]): DeliveryValues {
  return {
    everyDay: d.routeWeekdays === null,
    days: d.routeWeekdays ?? bakeryDays,
    minimum: d.minimumOrderCents ? toDecimal(d.minimumOrderCents) : "",
    priceListId: d.priceListId ? String(d.priceListId) : "none",
  };
}

/** The form's values under the server's names, for `deliverySchema`. */
export function deliveryInput(v: DeliveryValues) {
  return { routeWeekdays: v.everyDay ? null : v.days, minimumOrderCents: v.minimum, priceListId: v.priceListId === "none" ? null : Number(v.priceListId) };
}

const shape = accountDeliverySchema.shape;

/**
 * The shared delivery schema over the typed minimum (empty is no minimum); "only some days" with none
 * chosen is refused once the rest passes.
 */
export const deliverySchema = z
  .object({
    routeWeekdays: shape.routeWeekdays,
    minimumOrderCents: readText<number>((text) => {
      const cents = text.trim() === "" ? 0 : parseMoney(text);
      return cents === null ? { message: "Write it in dollars and cents, like 50.00 (empty for no minimum)." } : { value: cents };
    }).pipe(shape.minimumOrderCents),
    priceListId: shape.priceListId,
  })
  .superRefine((v, ctx) => {
    if (v.routeWeekdays && v.routeWeekdays.length === 0) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ["routeWeekdays"], message: "Choose at least one day, or deliver on every delivery day." });
  });
