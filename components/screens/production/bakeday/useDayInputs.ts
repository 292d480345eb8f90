import { useEffect, useRef, useState } from "react";
import { useSaveBakeDayMutation, type BakeDayInput, type PlanView } from "../../../api/production";
import { messageOf } from "../../../api/client";
import { parseQuantity } from "../../../ordering/quantities";
import type { Temps } from "../../../production/temperatures";

type Changes = { what: string; changes: string[] } | null;
type Waiter = { resolve: () => void; reject: (error: unknown) => void };

const typedExtras = (products: PlanView["products"]) => Object.fromEntries(products.map((p) => [String(p.productId), String(p.extraPans)]));

/** The extra pans as typed, or null while one of them is not a whole number of pans from 0 to 100. */
function extrasBody(source: Record<string, string>): Record<string, number> | null {
  const out: Record<string, number> = {};
  for (const [id, text] of Object.entries(source)) {
    const n = parseQuantity(text);
    if (Number.isNaN(n) || n < 0 || n > 100) return null;
    out[id] = n;
  }
  return out;
}

/**
 * The baker's inputs for the day: extra pans (saved as they are typed) and the temperatures (saved on purpose).
 * Saves go one at a time; changes made while one is on its way are sent (latest only) when it lands, and a
 * temperature save answers its card when the save that carried it lands.
 */
export function useDayInputs(date: string, plan: PlanView, onChanges: (changes: Changes) => void) {
  const save = useSaveBakeDayMutation(date);
  const [extras, setExtras] = useState<Record<string, string>>(() => typedExtras(plan.products));
  const [pansError, setPansError] = useState<string | null>(null);
  const [tempsSaved, setTempsSaved] = useState(false);
  const [savingTemps, setSavingTemps] = useState(false);
  const inFlight = useRef(false);
  const queued = useRef<{ input: BakeDayInput; temps: boolean } | null>(null);
  const tempWaiters = useRef<Waiter[]>([]);

  const answerTemps = (error: unknown | null) => {
    const waiting = tempWaiters.current;
    tempWaiters.current = [];
    for (const w of waiting) error === null ? w.resolve() : w.reject(error);
  };

  const send = (input: BakeDayInput, temps: boolean) => {
    if (inFlight.current) {
      queued.current = { input, temps: temps || !!queued.current?.temps };
      return;
    }
    inFlight.current = true;
    setPansError(null);
    if (temps) setSavingTemps(true);
    save.mutate(input, {
      onSuccess: (p) => {
        if (temps) {
          setTempsSaved(true);
          answerTemps(null);
        }
        if (p.changes.length) onChanges({ what: "Plan recalculated with your inputs.", changes: p.changes });
      },
      onError: (error) => (temps ? answerTemps(error) : setPansError(messageOf(error))),
      onSettled: () => {
        inFlight.current = false;
        if (temps) setSavingTemps(false);
        const next = queued.current;
        queued.current = null;
        if (next) send(next.input, next.temps);
      },
    });
  };

  // A plan that arrives from elsewhere (a refetch, another device) brings its extra pans, unless a save of ours is on its way.
  const planExtras = plan.products.map((p) => `${p.productId}:${p.extraPans}`).join(",");
  useEffect(() => {
    if (inFlight.current || queued.current) return;
    setExtras((current) => {
      const fresh = typedExtras(plan.products);
      const same = Object.keys(fresh).every((k) => parseQuantity(current[k] ?? "") === Number(fresh[k]));
      return same ? current : fresh;
    });
  }, [planExtras]);

  const onExtra = (productId: number, text: string) => {
    const nextExtras = { ...extras, [String(productId)]: text };
    setExtras(nextExtras);
    setTempsSaved(false);
    const body = extrasBody(nextExtras);
    if (!body) return;
    send({ extraPans: body, roomC: plan.inputs.roomC, flourC: plan.inputs.flourC, pasteC: plan.inputs.pasteC }, false);
  };

  const onTemps = (t: Temps) =>
    new Promise<void>((resolve, reject) => {
      tempWaiters.current.push({ resolve, reject });
      setTempsSaved(false);
      const body = extrasBody(extras) ?? Object.fromEntries(plan.products.map((p) => [String(p.productId), p.extraPans]));
      send({ extraPans: body, ...t }, true);
    });

  return {
    extras,
    /** After a recalculation: the extra pans the new plan has. */
    resetExtras: (p: PlanView) => setExtras(typedExtras(p.products)),
    onExtra,
    onTemps,
    pansError,
    savingPans: save.isPending && !savingTemps,
    savingTemps,
    tempsSaved,
  };
}
