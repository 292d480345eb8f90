/**
 * One contract from database to screen (issue 11): the server's services return the types in shared/ and the
 * client's api modules read the same ones, so a field the server renames and the client does not follow fails
 * the type check (`npx tsc --noEmit`, the first test stage, compiles this file). The `type` checks below are
 * that proof; the `@ts-expect-error` lines prove the checks can fail. The runtime part checks the request
 * schemas moved out of the route files into shared/schemas.
 */
import type { board } from "../../server/orders/board.service";
import type { forecast, freeze, getPlan, saveBakeDay } from "../../server/production/plan.service";
import type { formulaHistory } from "../../server/production/formulas.service";
import type { listOutbox } from "../../server/mail/outbox.service";
import type { materialiseAll } from "../../server/orders/standing.service";
import type { getFeed } from "../../server/orders/feed.service";
import type { accountCounts } from "../../server/accounts/accounts.service";
import type { officeOverview } from "../../server/bakery/overview.service";
import type { userCounts } from "../../server/users/users.service";
import type { invitationPreview } from "../../server/auth/auth.service";
import type { boardApi, BoardDto } from "../../components/api/board";
import type { ForecastDto, PlanView, productionApi } from "../../components/api/production";
import type { FormulaVersionDto, formulasApi } from "../../components/api/formulas";
import type { OutboxMailDto, outboxApi } from "../../components/api/outbox";
import type { MaterialiseResult, standingApi } from "../../components/api/standing";
import type { feedApi } from "../../components/api/feed";
import type { officeApi } from "../../components/api/office";
import type { authApi } from "../../components/api/auth";
import { accountIdQuerySchema, idParamSchema } from "../../shared/schemas/common";
import { dateQuerySchema } from "../../shared/schemas/calendar";
import { accountListQuerySchema } from "../../shared/schemas/accounts";
import { userListQuerySchema } from "../../shared/schemas/users";
import { MAIL_STATUSES, outboxListQuerySchema } from "../../shared/schemas/outbox";
import { forecastQuerySchema, formulaVersionQuerySchema, planPdfQuerySchema } from "../../shared/schemas/production";

/** true only when A and B are the same type (not merely assignable one way). */
type Equal<A, B> = (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
type Expect<T extends true> = T;
type Served<F extends (...args: never[]) => unknown> = Awaited<ReturnType<F>>;

// ---- what a service returns is what the client reads ------------------------------------------------

export type Contract = [
  Expect<Equal<Served<typeof board>, BoardDto>>,
  Expect<Equal<Served<typeof board>, Served<typeof boardApi.get>>>,
  Expect<Equal<Served<typeof forecast>, ForecastDto>>,
  Expect<Equal<Served<typeof forecast>, Served<typeof productionApi.forecast>>>,
  Expect<Equal<Served<typeof getPlan>, PlanView>>,
  Expect<Equal<Served<typeof freeze>, Served<typeof productionApi.recalculate>>>,
  Expect<Equal<Served<typeof saveBakeDay>, Served<typeof productionApi.saveBakeDay>>>,
  Expect<Equal<Parameters<typeof saveBakeDay>[2], Parameters<typeof productionApi.saveBakeDay>[1]>>,
  Expect<Equal<Served<typeof formulaHistory>, FormulaVersionDto[]>>,
  Expect<Equal<Served<typeof formulaHistory>, Served<typeof formulasApi.history>>>,
  Expect<Equal<Served<typeof listOutbox>, OutboxMailDto[]>>,
  Expect<Equal<Served<typeof listOutbox>, Served<typeof outboxApi.list>>>,
  Expect<Equal<Served<typeof materialiseAll>, MaterialiseResult>>,
  Expect<Equal<Served<typeof materialiseAll>, Served<typeof standingApi.materialise>>>,
  Expect<Equal<Served<typeof getFeed>["url"], Served<typeof feedApi.get>>>,
  Expect<Equal<{ users: Served<typeof userCounts>; accounts: Served<typeof accountCounts>; overview: Served<typeof officeOverview> }, Served<typeof officeApi.summary>>>,
  Expect<Equal<ReturnType<typeof invitationPreview>, Served<typeof authApi.invitation>>>,
];

// ---- and the checks bite --------------------------------------------------------------------------

type ServerBoard = Served<typeof board>;
type ServerForecast = Served<typeof forecast>;
type ServerOutbox = Served<typeof listOutbox>[number];

// @ts-expect-error the board has no such field on either side
export type NoSuchBoardField = ServerBoard["grandTotalCents"];
// @ts-expect-error nor a forecast row
export type NoSuchForecastField = ServerForecast["items"][number]["packCount"];

/** A server that renamed a field the client still reads. */
type RenamedOnServer<T, From extends keyof T, To extends string> = Omit<T, From> & Record<To, T[From]>;
export type Drifted = [
  // @ts-expect-error a board whose totalCents the server renamed is not the client's board
  Expect<Equal<RenamedOnServer<ServerBoard, "totalCents", "sumCents">, BoardDto>>,
  // @ts-expect-error a forecast whose totalCostCents the server renamed is not the client's forecast
  Expect<Equal<RenamedOnServer<ServerForecast, "totalCostCents", "costCents">, ForecastDto>>,
  // @ts-expect-error an outbox row whose status the server renamed is not the client's row
  Expect<Equal<RenamedOnServer<ServerOutbox, "status", "state">, OutboxMailDto>>,
];

export const driftedBoard = (b: RenamedOnServer<ServerBoard, "totalCents", "sumCents">): BoardDto =>
  // @ts-expect-error and cannot be handed to a screen that reads BoardDto
  b;

// ---- the request schemas the routes use, from shared/schemas ----------------------------------------

const messages = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => `${i.path.map(String).join(".")}: ${i.message}`);

describe("request schemas moved out of the route files", () => {
  it("an :id is a positive whole number, with the same messages as before", () => {
    expect(idParamSchema.parse({ id: "42" })).toEqual({ id: 42 });
    expect(messages(idParamSchema.safeParse({ id: "abc" }))).toEqual(["id: Must be a number."]);
    expect(messages(idParamSchema.safeParse({ id: "1.5" }))).toEqual(["id: Must be a whole number."]);
    expect(messages(idParamSchema.safeParse({ id: "0" }))).toEqual(["id: Must be a positive number."]);
  });

  it("?accountId= is optional and positive", () => {
    expect(accountIdQuerySchema.parse({})).toEqual({});
    expect(accountIdQuerySchema.parse({ accountId: "7" })).toEqual({ accountId: 7 });
    expect(accountIdQuerySchema.safeParse({ accountId: "-1" }).success).toBe(false);
  });

  it("a date is YYYY-MM-DD within the supported years", () => {
    expect(dateQuerySchema.parse({ date: "2026-06-11" })).toEqual({ date: "2026-06-11" });
    expect(dateQuerySchema.safeParse({ date: "11/06/2026" }).success).toBe(false);
    expect(dateQuerySchema.safeParse({ date: "2100-01-01" }).success).toBe(false);
    expect(forecastQuerySchema.parse({ from: "2026-06-11" })).toEqual({ from: "2026-06-11" });
    expect(forecastQuerySchema.safeParse({}).success).toBe(false);
  });

  it("the production sheet is metric unless asked for US units; a formula version is positive", () => {
    expect(planPdfQuerySchema.parse({ date: "2026-06-11" })).toEqual({ date: "2026-06-11", units: "metric" });
    expect(planPdfQuerySchema.parse({ date: "2026-06-11", units: "us" }).units).toBe("us");
    expect(planPdfQuerySchema.safeParse({ date: "2026-06-11", units: "imperial" }).success).toBe(false);
    expect(formulaVersionQuerySchema.parse({ version: "3" })).toEqual({ version: 3 });
    expect(formulaVersionQuerySchema.parse({})).toEqual({});
    expect(formulaVersionQuerySchema.safeParse({ version: "0" }).success).toBe(false);
  });

  it("list searches are trimmed and at most 100 characters; statuses are the known ones", () => {
    expect(userListQuerySchema.parse({ q: "  ann " })).toEqual({ q: "ann" });
    expect(userListQuerySchema.safeParse({ q: "x".repeat(101) }).success).toBe(false);
    expect(accountListQuerySchema.parse({ q: " pier ", status: "on_hold" })).toEqual({ q: "pier", status: "on_hold" });
    expect(accountListQuerySchema.safeParse({ status: "paused" }).success).toBe(false);
    expect(MAIL_STATUSES).toEqual(["pending", "sending", "sent", "failed"]);
    for (const status of MAIL_STATUSES) expect(outboxListQuerySchema.parse({ status })).toEqual({ status });
    expect(outboxListQuerySchema.parse({})).toEqual({});
    expect(outboxListQuerySchema.safeParse({ status: "bounced" }).success).toBe(false);
  });
});
