import { Dimensions } from "react-native";
import { act, fireEvent, screen, waitFor, within } from "expo-router/testing-library";
import { BAKER, OWNER, SETTINGS, apiError, mockApi, renderApp, sessionRoutes, signedInAs, type FakeRequest, type Route } from "./helpers";
import { LATE_SHIFT, PRODUCTION_SETTINGS, planView } from "./production-fixtures";
import { setUnitSystem } from "../../components/production/units";
import { formatMass, formatTemperature } from "../../shared/units";
import type { PlanView } from "../../components/api/production";

const original = Dimensions.get("window");
function setWidth(width: number) {
  const size = { width, height: 800, scale: 1, fontScale: 1 };
  Dimensions.set({ window: size, screen: size });
}
afterEach(() => Dimensions.set({ window: original, screen: original }));
beforeEach(() => setUnitSystem("metric"));

function routes(plan: PlanView = planView(), extra: Record<string, Route> = {}): Record<string, Route> {
  let progress = plan.progress;
  return {
    ...sessionRoutes(BAKER),
    "GET /api/settings/calendar": { body: { settings: SETTINGS } },
    "GET /api/production/next-day": { body: { date: "2025-12-03" } },
    "GET /api/production/settings": { body: { settings: PRODUCTION_SETTINGS } },
    "GET /api/production/plan": (req: FakeRequest) => ({ body: { plan: { ...plan, date: req.query.date, progress } } }),
    "POST /api/production/bake-days/:date/progress": (req: FakeRequest) => {
      const b = req.body as { kind: "mix" | "wave"; key: string; done: boolean };
      if (b.kind === "mix") progress = { ...progress, mixes: b.done ? [...progress.mixes, b.key] : progress.mixes.filter((k) => k !== b.key) };
      else progress = { ...progress, waves: b.done ? [...progress.waves, Number(b.key)] : progress.waves.filter((w) => w !== Number(b.key)) };
      return { body: { progress } };
    },
    ...extra,
  };
}

describe("bake day", () => {
  beforeEach(() => signedInAs(BAKER));

  it("is the baker's home: the next bake day with big pan counts, the not-final banner and the day's progress", async () => {
    const api = mockApi(routes());
    renderApp("/bake");
    expect(await screen.findByTestId("pans-101-count")).toHaveTextContent("7");
    expect(screen.getByTestId("baker-home-title")).toHaveTextContent("Bake day");
    expect(api.callsTo("GET", "/api/production/plan")[0].query.date).toBe("2025-12-03");
    expect(screen.getByTestId("day-date")).toHaveTextContent("Wed, Dec 3");
    const tile = screen.getByTestId("pans-101");
    expect(tile).toHaveTextContent(/Milk-bread dinner rolls/);
    expect(tile).toHaveTextContent(/9×13 in pan/);
    expect(tile).toHaveTextContent(/7 ordered · 105 pieces of 67 g/);
    expect(tile).toHaveTextContent(/3 still open/);
    expect(screen.getByLabelText("7 pans of Milk-bread dinner rolls")).toBeOnTheScreen();
    expect(screen.getByTestId("pans-102-count")).toHaveTextContent("2");
    expect(screen.getByTestId("pans-total")).toHaveTextContent("9 pans in all");
    expect(screen.getByTestId("plan-status-text")).toHaveTextContent("Not final — orders can change until the cut-off at Tue, Dec 2, 2:00 PM CST.");
    expect(screen.getByTestId("plan-progress-text")).toHaveTextContent("0 of 3 mixes done, 0 of 3 oven loads baked");
    expect(screen.getByTestId("plan-warnings")).toHaveTextContent(/Milk bread, mix 2: liquid at 1\.5 °C/);
    expect(await screen.findByTestId("setting-ovens")).toHaveTextContent("Deck oven (9,100 cm² of shelf); Convection oven (5 pan slots)");
    expect(screen.getByTestId("setting-mixer")).toHaveTextContent("Spiral mixer, 20 kg; 60-qt planetary, 12 kg");
    expect(screen.getByTestId("setting-crew")).toHaveTextContent("3 people from 11:30 PM · packing 45 min before dispatch");
    expect(screen.getByTestId("tab-bake")).toBeOnTheScreen();
  });

  it("says when the plan is final and when it was set at the cut-off", async () => {
    mockApi(routes(planView({ final: true, frozen: true, frozenAt: "2025-12-02T20:00:05.000Z" })));
    renderApp("/bake");
    expect(await screen.findByTestId("plan-status-text")).toHaveTextContent("Final — orders are locked for this day.");
    expect(screen.getByTestId("plan-frozen-at")).toHaveTextContent("Plan set at the cut-off and kept; worked out Tue, Dec 2, 2:00 PM CST.");
  });

  it("keeps the paste apart from the final mix on each weigh-out card, with the liquid temperature", async () => {
    mockApi(routes());
    renderApp("/bake");
    const paste = await screen.findByTestId("mix-1-1-paste");
    expect(paste).toHaveTextContent(/Cook to 65 °C, then cool/);
    expect(within(paste).getByTestId("mix-1-1-paste-1")).toHaveTextContent("Bread flour95 g");
    expect(within(paste).getByTestId("mix-1-1-paste-2")).toHaveTextContent("Whole milk475 g");
    expect(within(paste).getByTestId("mix-1-1-paste-caution")).toHaveTextContent(/Hot paste/);
    const final = screen.getByTestId("mix-1-1-final");
    expect(within(final).getByTestId("mix-1-1-final-paste")).toHaveTextContent("Cooled paste (all of it)570 g");
    expect(within(final).getByTestId("mix-1-1-final-1")).toHaveTextContent("Bread flour1,805 g");
    expect(within(final).getByTestId("mix-1-1-final-2")).toHaveTextContent("Whole milk1,000 g");
    expect(within(final).getByTestId("mix-1-1-final-7")).toHaveTextContent("Fine sea salt34.2 g");
    expect(within(final).getByTestId("mix-1-1-mix-caution")).toHaveTextContent(/Mixer guards/);
    expect(screen.getByTestId("mix-1-1-dough")).toHaveTextContent("3,800 g");
    expect(screen.getByTestId("mix-1-1-liquid")).toHaveTextContent("26 °C");
    expect(screen.getByTestId("mix-1-1")).toHaveTextContent(/Mix 1 of 2/);
    // Mix 2 needs colder liquid than water can be: the advice is on its card.
    expect(screen.getByTestId("mix-1-2-liquid")).toHaveTextContent("1.5 °C");
    expect(screen.getByTestId("mix-1-2-advice")).toHaveTextContent(/crushed ice/);
    expect(screen.queryByTestId("mix-1-1-advice")).toBeNull();
    // Brioche has no paste: only the final mix.
    expect(screen.queryByTestId("mix-3-1-paste")).toBeNull();
    expect(screen.getByTestId("mix-3-1-final-5")).toHaveTextContent("Whole egg629 g");
    expect(screen.getByTestId("mix-3-1-liquid")).toHaveTextContent("16 °C");
  });

  it("lays the day out as mixes and oven loads in time order, every step with its time, its mixer, oven or crew, and its caution", async () => {
    mockApi(routes());
    renderApp("/bake");
    const mix1 = await screen.findByTestId("mix-group-1-1");
    expect(mix1).toHaveTextContent(/Milk bread · mix 1 of 2.*Makes 6 pans: Milk-bread dinner rolls/);
    expect(within(mix1).getByTestId("step-f1-m1-paste")).toHaveTextContent(/1:00 AM–1:40 AM.*Cook and cool the paste.*Hot paste/);
    expect(within(mix1).getByTestId("step-f1-m1-mix")).toHaveTextContent(/1:40 AM–1:55 AM.*Mix.*Spiral mixer.*Mixer guards/);
    expect(within(mix1).getByTestId("step-f1-m1-divide")).toHaveTextContent(/2:55 AM–3:10 AM.*Divide and round.*Crew \(3 people\).*Allergen separation/);
    expect(screen.getByTestId("step-f3-m1-mix-resource")).toHaveTextContent("60-qt planetary");
    const load1 = screen.getByTestId("load-1");
    expect(load1).toHaveTextContent(/Oven load 1 · Deck oven · 6 pans · 177 °C.*Milk-bread dinner rolls/);
    expect(within(load1).getByTestId("step-f1-m1-L1-shape")).toHaveTextContent(/3:12 AM–3:34 AM.*Shape and pan · Milk bread, mix 1 · 6 pans.*Crew \(3 people\)/);
    expect(within(load1).getByTestId("step-f1-m1-L1-proof-note")).toHaveTextContent("21 min longer than the formula's 50 min: the crew is busy with other dough later.");
    expect(within(load1).getByTestId("step-L1-bake")).toHaveTextContent(/4:50 AM–5:17 AM.*Bake 27 min · oven 177 °C.*Deck oven.*Hot ovens and pans/);
    expect(within(load1).getByTestId("step-L1-cool-25")).toHaveTextContent(/Cooling and storage/);
    // The convection oven heats from 177 to 190 °C before the brioche goes in: that step sits with its load.
    const load3 = screen.getByTestId("load-3");
    expect(load3).toHaveTextContent(/Oven load 3 · Convection oven · 2 pans · 190 °C.*Brioche burger buns/);
    expect(within(load3).getByTestId("step-heat-2-287")).toHaveTextContent(/4:47 AM–4:57 AM.*Heat Convection oven · oven 190 °C/);
    // Blocks in time order: the mixes first, the oven loads by when they go in.
    const order = screen.getAllByTestId(/^(mix-group-\d+-\d+|load-\d+)$/).map((n) => n.props.testID);
    expect(order).toEqual(["mix-group-1-1", "mix-group-1-2", "mix-group-3-1", "load-1", "load-3", "load-2"]);
    expect(screen.getByTestId("timeline-dispatch")).toHaveTextContent("Dispatch 6:30 AM");
    expect(screen.getByTestId("timeline-packing")).toHaveTextContent(/Pack and load from 5:45 AM \(45 min before dispatch\): every step ends by then\. The shift starts at 11:30 PM\./);
    expect(screen.queryByTestId("timeline-conflicts")).toBeNull();
    expect(screen.getByTestId("caution-footnote")).toHaveTextContent(/Reminders only/);
  });

  it("says when the day does not fit the shift, which step and by how much, and the start that fits", async () => {
    mockApi(routes(planView(LATE_SHIFT)));
    renderApp("/bake");
    const box = await screen.findByTestId("timeline-conflicts");
    expect(box).toHaveTextContent(/The day does not fit the shift/);
    expect(screen.getByTestId("timeline-earlier-start")).toHaveTextContent("Start 40 min earlier, at 1:00 AM.");
    expect(screen.getByTestId("timeline-conflict-0")).toHaveTextContent(/Cook and cool the paste \(Milk bread, mix 1\) has to start at 1:00 AM, 40 min before the shift starts at 1:40 AM/);
  });

  it("shows each weigh-out card's mix time and mixer, the same as its mix step", async () => {
    mockApi(routes());
    renderApp("/bake");
    expect(await screen.findByTestId("mix-1-1-time")).toHaveTextContent("Mix 1:40 AM–1:55 AM on Spiral mixer · paste on at 1:00 AM");
    expect(screen.getByTestId("mix-1-2-time")).toHaveTextContent("Mix 1:55 AM–2:10 AM on Spiral mixer · paste on at 1:15 AM");
    expect(screen.getByTestId("mix-3-1-time")).toHaveTextContent("Mix 1:59 AM–2:19 AM on 60-qt planetary");
    expect(screen.getByTestId("step-f1-m1-mix")).toHaveTextContent(/1:40 AM–1:55 AM/);
  });

  it("from 1024 px draws a lane per mixer, the crew and each oven on one time scale", async () => {
    setWidth(1280);
    mockApi(routes());
    renderApp("/bake");
    expect(await screen.findByTestId("timeline-lanes")).toBeOnTheScreen();
    for (const id of ["lane-mixer-1", "lane-mixer-2", "lane-crew-0", "lane-oven-1", "lane-oven-2"]) expect(screen.getByTestId(id)).toBeOnTheScreen();
    expect(screen.getByLabelText("Spiral mixer: Mix, mix 1 from 1:40 AM to 1:55 AM")).toBeOnTheScreen();
    expect(screen.getByLabelText("Crew (3 people): Shape and pan, mix 1, oven load 1 from 3:12 AM to 3:34 AM")).toBeOnTheScreen();
    expect(screen.getByLabelText("Deck oven: Oven load 1 from 4:47 AM to 5:20 AM")).toBeOnTheScreen();
    expect(screen.getByLabelText("Convection oven: Heat Convection oven from 4:47 AM to 4:57 AM")).toBeOnTheScreen();
    expect(screen.getByTestId("step-L3-bake")).toHaveTextContent(/5:05 AM–5:21 AM.*Bake 16 min · oven 190 °C/);
    expect(screen.getByTestId("app-shell-wide")).toBeOnTheScreen();
  });

  it("marks the step under way by the bakery's clock", async () => {
    // The fake bakery's clock reads Tue, Dec 2, 5:30 AM CST.
    const move = (iso: string) => iso.replace("2025-12-03", "2025-12-02");
    const today = planView().timeline.map((e) => ({ ...e, startsAt: move(e.startsAt), endsAt: move(e.endsAt) }));
    mockApi(routes(planView({ date: "2025-12-02", timeline: today, schedule: undefined })));
    renderApp("/bake/day?date=2025-12-02");
    const now = await screen.findAllByTestId("timeline-now");
    expect(now).toContain(within(screen.getByTestId("step-L1-cool-25")).getByTestId("timeline-now"));
    // Three coolings run at 05:30 (oven loads 1, 2 and 3); nothing else does.
    expect(screen.getAllByTestId("timeline-now")).toHaveLength(3);
    expect(within(screen.getByTestId("step-L1-bake")).queryByTestId("timeline-now")).toBeNull();
  });

  it("switches to pounds, ounces and °F (NIST factors) and back", async () => {
    mockApi(routes());
    renderApp("/bake");
    await screen.findByTestId("mix-1-1-final-2");
    fireEvent.press(screen.getByTestId("units-us"));
    // 1000 g = 2 lb 3.27 oz (1 lb = 453.592 37 g); 26 °C = 78.8 °F, shown as 79 °F.
    expect(formatMass(1000, "us")).toBe("2 lb 3.27 oz");
    expect(formatTemperature(26, "us")).toBe("79 °F");
    expect(screen.getByTestId("mix-1-1-final-2")).toHaveTextContent("Whole milk2 lb 3.27 oz");
    expect(screen.getByTestId("mix-1-1-liquid")).toHaveTextContent("79 °F");
    expect(screen.getByTestId("mix-1-1-paste")).toHaveTextContent(/Cook to 149 °F/);
    expect(screen.getByTestId("step-L1-bake")).toHaveTextContent(/oven 351 °F/);
    expect(screen.getByTestId("load-1")).toHaveTextContent(/Oven load 1 · Deck oven · 6 pans · 351 °F/);
    expect(screen.getByLabelText("Room (°F)")).toHaveDisplayValue("72");
    fireEvent.press(screen.getByTestId("units-metric"));
    expect(screen.getByTestId("mix-1-1-final-2")).toHaveTextContent("Whole milk1,000 g");
    expect(screen.getByTestId("mix-1-1-liquid")).toHaveTextContent("26 °C");
  });

  it("ticks a mix weighed and mixed, and an oven load baked, with the right progress bodies", async () => {
    const api = mockApi(routes());
    renderApp("/bake");
    fireEvent.press(await screen.findByTestId("mix-1-1-done"));
    await waitFor(() => expect(api.callsTo("POST", "/api/production/bake-days/2025-12-03/progress")).toHaveLength(1));
    expect(api.callsTo("POST", "/api/production/bake-days/2025-12-03/progress")[0].body).toEqual({ kind: "mix", key: "1:1", done: true });
    expect(await screen.findByTestId("mix-1-1-done-badge")).toHaveTextContent("Mixed");
    await waitFor(() => expect(screen.getByTestId("plan-progress-text")).toHaveTextContent("1 of 3 mixes done, 0 of 3 oven loads baked"));
    expect(screen.getByTestId("mix-1-1-done")).toBeChecked();

    fireEvent.press(screen.getByTestId("load-1-baked"));
    await waitFor(() => expect(api.callsTo("POST", "/api/production/bake-days/2025-12-03/progress")).toHaveLength(2));
    expect(api.callsTo("POST", "/api/production/bake-days/2025-12-03/progress")[1].body).toEqual({ kind: "wave", key: "1", done: true });
    await waitFor(() => expect(screen.getByTestId("plan-progress-text")).toHaveTextContent("1 of 3 mixes done, 1 of 3 oven loads baked"));

    // And off again.
    fireEvent.press(screen.getByTestId("mix-1-1-done"));
    await waitFor(() => expect(api.callsTo("POST", "/api/production/bake-days/2025-12-03/progress")).toHaveLength(3));
    expect(api.callsTo("POST", "/api/production/bake-days/2025-12-03/progress")[2].body).toEqual({ kind: "mix", key: "1:1", done: false });
  });

  it("saves extra pans through PUT bake-days with the day's temperatures", async () => {
    const saved = planView({ products: planView().products.map((p) => (p.productId === 101 ? { ...p, extraPans: 1, pans: 8 } : p)) });
    const api = mockApi(routes(planView(), { "PUT /api/production/bake-days/:date": { body: { plan: saved } } }));
    renderApp("/bake");
    fireEvent.press(await screen.findByTestId("extra-101-inc"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/production/bake-days/2025-12-03")).toHaveLength(1));
    expect(api.callsTo("PUT", "/api/production/bake-days/2025-12-03")[0].body).toEqual({ extraPans: { "101": 1, "102": 0 }, roomC: 22, flourC: 20, pasteC: 30 });
    await waitFor(() => expect(screen.getByTestId("pans-101-count")).toHaveTextContent("8"));
    expect(screen.getByTestId("pans-101-units")).toHaveTextContent(/^7 ordered \+ 1 extra pan · 105 pieces/);
    expect(screen.getByTestId("extra-101")).toHaveDisplayValue("1");
  });

  it("takes the temperatures in °F when the US units are on, and saves them in °C", async () => {
    const api = mockApi(routes(planView(), { "PUT /api/production/bake-days/:date": (req: FakeRequest) => ({ body: { plan: planView({ inputs: { ...planView().inputs, ...(req.body as object) } }) } }) }));
    renderApp("/bake");
    await screen.findByTestId("temp-room");
    fireEvent.press(screen.getByTestId("units-us"));
    fireEvent.changeText(screen.getByTestId("temp-room"), "200");
    fireEvent.press(screen.getByTestId("temps-save"));
    expect(screen.getByTestId("temp-room-error")).toHaveTextContent("Enter 14 °F to 122 °F.");
    expect(api.callsTo("PUT", "/api/production/bake-days/2025-12-03")).toHaveLength(0);
    fireEvent.changeText(screen.getByTestId("temp-room"), "75");
    fireEvent.press(screen.getByTestId("temps-save"));
    await waitFor(() => expect(api.callsTo("PUT", "/api/production/bake-days/2025-12-03")).toHaveLength(1));
    // 75 °F = 23.9 °C; 68 °F = 20 °C; 86 °F = 30 °C.
    expect(api.callsTo("PUT", "/api/production/bake-days/2025-12-03")[0].body).toEqual({ extraPans: { "101": 0, "102": 0 }, roomC: 23.9, flourC: 20, pasteC: 30, tapC: 15, milkC: 4 });
    expect(await screen.findByTestId("temps-saved")).toBeOnTheScreen();
  });

  it("shows the server's message next to a temperature it refused", async () => {
    mockApi(routes(planView(), { "PUT /api/production/bake-days/:date": apiError(400, "validation_error", "Paste temperature can be at most 100.", { pasteC: "Paste temperature can be at most 100." }) }));
    renderApp("/bake");
    fireEvent.changeText(await screen.findByTestId("temp-paste"), "95");
    fireEvent.press(screen.getByTestId("temps-save"));
    expect(await screen.findByTestId("temp-paste-error")).toHaveTextContent("Paste temperature can be at most 100.");
  });

  it("recalculates only after a confirm, then lists what changed", async () => {
    const after = planView({ frozen: true, frozenAt: "2025-12-02T11:40:00.000Z", changes: ["Milk-bread dinner rolls: 7 → 9 ordered, 7 → 9 pans."] });
    const api = mockApi(routes(planView(), { "POST /api/production/plan/recalculate": { body: { plan: after } } }));
    renderApp("/bake");
    fireEvent.press(await screen.findByTestId("recalculate"));
    expect(screen.getByTestId("recalculate-panel")).toHaveTextContent(/Recalculate from the current orders/);
    expect(api.callsTo("POST", "/api/production/plan/recalculate")).toHaveLength(0);
    fireEvent.press(screen.getByTestId("recalculate-cancel"));
    expect(screen.queryByTestId("recalculate-panel")).toBeNull();
    fireEvent.press(screen.getByTestId("recalculate"));
    fireEvent.press(screen.getByTestId("recalculate-confirm"));
    expect(await screen.findByTestId("plan-changes")).toHaveTextContent(/What changed:.*Milk-bread dinner rolls: 7 → 9 ordered, 7 → 9 pans\./);
    expect(api.callsTo("POST", "/api/production/plan/recalculate")[0].query.date).toBe("2025-12-03");
    await waitFor(() => expect(screen.getByTestId("plan-frozen-at")).toHaveTextContent("Plan set at the cut-off and kept; worked out Tue, Dec 2, 5:40 AM CST."));
    // What the recalculation changed is not "pending" any more.
    expect(screen.queryByTestId("plan-pending-changes")).toBeNull();
  });

  it("tells the baker when a plan set at the cut-off differs from a fresh calculation", async () => {
    mockApi(routes(planView({ final: true, frozen: true, frozenAt: "2025-12-02T20:00:00.000Z", changes: ["Milk bread: formula version 1 → 2."] })));
    renderApp("/bake");
    expect(await screen.findByTestId("plan-pending-changes")).toHaveTextContent(/Milk bread: formula version 1 → 2\./);
  });

  it("fetches the production sheet with the token in the units asked for", async () => {
    const api = mockApi(routes(planView(), { "GET /api/production/plan.pdf": { body: {} } }));
    renderApp("/bake");
    fireEvent.press(await screen.findByTestId("pdf-us"));
    await waitFor(() => expect(api.callsTo("GET", "/api/production/plan.pdf")).toHaveLength(1));
    const req = api.callsTo("GET", "/api/production/plan.pdf")[0];
    expect(req.query).toEqual({ date: "2025-12-03", units: "us" });
    expect(req.headers.Authorization).toBe(`Bearer token-for-${BAKER.id}`);
    fireEvent.press(screen.getByTestId("pdf-metric"));
    await waitFor(() => expect(api.callsTo("GET", "/api/production/plan.pdf")).toHaveLength(2));
    expect(api.callsTo("GET", "/api/production/plan.pdf")[1].query.units).toBe("metric");
  });

  it("steps to the previous and next bake day by the delivery calendar", async () => {
    const api = mockApi(routes());
    renderApp("/bake/day?date=2025-12-06");
    expect(await screen.findByTestId("bake-day-title")).toHaveTextContent("Bake day");
    await screen.findByTestId("pans-101-count");
    // Saturday → Tuesday: no deliveries on Sunday and Monday.
    fireEvent.press(screen.getByTestId("day-next"));
    await waitFor(() => expect(api.calls.some((c) => c.path === "/api/production/plan" && c.query.date === "2025-12-09")).toBe(true));
    expect(await screen.findByTestId("day-date")).toHaveTextContent("Tue, Dec 9");
    fireEvent.press(screen.getByTestId("day-prev"));
    await waitFor(() => expect(screen.getByTestId("day-date")).toHaveTextContent("Sat, Dec 6"));
    fireEvent.press(screen.getByTestId("day-pick"));
    fireEvent.changeText(screen.getByTestId("day-pick-input"), "2025-12-1");
    fireEvent.press(screen.getByTestId("day-pick-go"));
    expect(screen.getByTestId("day-pick-input-error")).toHaveTextContent(/YYYY-MM-DD/);
    fireEvent.press(screen.getByTestId("day-chip-2025-12-04"));
    await waitFor(() => expect(screen.getByTestId("day-date")).toHaveTextContent("Thu, Dec 4"));
  });

  it("says so when nothing is ordered for the day", async () => {
    mockApi(routes(planView({ products: [], doughs: [], ingredients: [], timeline: [], warnings: [] })));
    renderApp("/bake");
    expect(await screen.findByTestId("bake-day-empty")).toHaveTextContent(/Nothing to bake for Wed, Dec 3.*No orders for this day yet/);
    expect(screen.queryByTestId("recalculate")).toBeNull();
  });

  it("says when the day is not a delivery day", async () => {
    mockApi(routes(planView({ date: "2025-12-08", products: [], doughs: [], ingredients: [], timeline: [], warnings: [] })));
    renderApp("/bake/day?date=2025-12-08");
    expect(await screen.findByTestId("bake-day-empty")).toHaveTextContent(/Monday is not a delivery day\./);
  });

  it("shows an error with a retry when the plan fails to load", async () => {
    let fail = true;
    mockApi(routes(planView(), { "GET /api/production/plan": () => (fail ? apiError(500, "internal", "Something went wrong on the server.") : { body: { plan: planView() } }) }));
    renderApp("/bake");
    expect(await screen.findByTestId("bake-day-error")).toHaveTextContent(/The plan didn't load/);
    fail = false;
    fireEvent.press(screen.getByTestId("bake-day-error-retry"));
    expect(await screen.findByTestId("pans-101-count")).toHaveTextContent("7");
  });

  it("puts formulas, buying and a More screen in the baker's tabs", async () => {
    mockApi(routes());
    renderApp("/bake");
    await screen.findByTestId("pans-101-count");
    expect(screen.getByTestId("tab-formulas")).toBeOnTheScreen();
    expect(screen.getByTestId("tab-forecast")).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId("tab-more"));
    expect(await screen.findByTestId("more-ingredients")).toBeOnTheScreen();
    expect(screen.getByTestId("more-me")).toBeOnTheScreen();
    await act(async () => undefined);
  });
});

describe("bake day for the owner", () => {
  it("opens from the office, with a link to change the production settings", async () => {
    signedInAs(OWNER);
    mockApi({ ...routes(), ...sessionRoutes(OWNER) });
    renderApp("/office/production/day?date=2025-12-03");
    expect(await screen.findByTestId("pans-101-count")).toHaveTextContent("7");
    expect(screen.getByTestId("bake-day-title")).toHaveTextContent("Bake day");
    expect(await screen.findByTestId("open-production-settings")).toBeOnTheScreen();
    expect(screen.getByTestId("back-to-production")).toBeOnTheScreen();
  });
});
