import React from "react";
import fs from "node:fs";
import path from "node:path";
import { Slot } from "expo-router";
import Head from "expo-router/head";
import { renderRouter, screen } from "expo-router/testing-library";
import { AppProviders } from "@/components/AppProviders";
import { screenTitleText } from "@/components/ui/ScreenTitle";
import { OWNER, account, mockApi, sessionRoutes, signedInAs, testQueryClient } from "./helpers";

// Jest runs the app as iOS, where Head only feeds the system's activity list; the web build uses the
// web Head (react-helmet). That one, in server mode here (no DOM), hands the title to a context to read.
jest.mock("expo-router/head", () => {
  const { Head: WebHead } = jest.requireActual("expo-router/build/head/ExpoHead.js");
  return { __esModule: true, default: WebHead };
});

type HelmetContext = NonNullable<React.ComponentProps<typeof Head.Provider>["context"]>;

function renderWithHead(initialUrl: string) {
  const context: HelmetContext = {};
  const queryClient = testQueryClient();
  function TestRoot() {
    return (
      <Head.Provider context={context}>
        <AppProviders queryClient={queryClient}>
          <Slot />
        </AppProviders>
      </Head.Provider>
    );
  }
  renderRouter({ appDir: "app", overrides: { _layout: TestRoot } }, { initialUrl });
  return () => {
    const [title] = (context.helmet?.title.toComponent() ?? []) as React.ReactElement<{ children?: React.ReactNode }>[];
    return title ? React.Children.toArray(title.props.children).join("") : "";
  };
}

describe("browser titles through expo-router's Head", () => {
  it("titles a signed-out page after its heading", async () => {
    mockApi({});
    const title = renderWithHead("/forgot-password");
    expect(await screen.findByTestId("page-title")).toHaveTextContent("Reset your password");
    expect(title()).toBe("Reset your password · Panwise");
  });

  it("titles the set-password page by the kind of link", async () => {
    mockApi({});
    const title = renderWithHead("/set-password?kind=invite&token=abc&email=new%40tidewater.test");
    expect(await screen.findByTestId("page-title")).toHaveTextContent("Accept your invitation");
    expect(title()).toBe("Accept your invitation · Panwise");
  });

  it("titles an office screen (inside the role gate and the shell)", async () => {
    signedInAs(OWNER);
    mockApi({ ...sessionRoutes(OWNER), "GET /api/accounts": { body: { accounts: [account()] } } });
    const title = renderWithHead("/office/accounts");
    expect(await screen.findByTestId("account-row-11")).toHaveTextContent(/Tidewater Café/);
    expect(title()).toBe(screenTitleText("Accounts"));
  });

  it("titles the page for an address with no route", async () => {
    mockApi({});
    const title = renderWithHead("/no-such-page");
    expect(await screen.findByText("There's no page here")).toBeOnTheScreen();
    expect(title()).toBe("There's no page here · Panwise");
  });
});

describe("every screen route sets its title", () => {
  const appDir = path.join(__dirname, "..", "..", "app");
  const routeFiles = (dir: string): string[] =>
    fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? routeFiles(path.join(dir, e.name)) : [path.join(dir, e.name)]));
  // Layouts frame screens; "/" and the old outbox address only redirect.
  const notScreens = new Set(["index.tsx", path.join("(office)", "office", "money", "outbox.tsx")]);
  const screens = routeFiles(appDir)
    .map((f) => path.relative(appDir, f))
    .filter((f) => !f.endsWith("_layout.tsx") && !notScreens.has(f));

  it.each(screens)("%s renders a ScreenTitle", (file) => {
    const source = fs.readFileSync(path.join(appDir, file), "utf8");
    expect(source).toMatch(/<ScreenTitle title=/);
  });
});
