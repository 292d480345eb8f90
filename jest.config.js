/** One Jest config, three projects: app screens (jest-expo), server + shared (node), browser journeys (node + Chromium). */
// The server code compiled as `npm start` runs it: tsx (esbuild) has legacy decorators and emits no decorator metadata
// (esbuild does not support emitDecoratorMetadata; tsconfig.json has it off), so swc emits none either. An entity
// column without an explicit `type` then fails here as it does at start-up (tests/server/decorator-metadata.test.ts).
const swc = [
  "@swc/jest",
  {
    jsc: {
      parser: { syntax: "typescript", decorators: true },
      transform: { legacyDecorator: true, decoratorMetadata: false },
      target: "es2022",
    },
    module: { type: "commonjs" },
  },
];

module.exports = {
  projects: [
    {
      displayName: "app",
      preset: "jest-expo",
      testMatch: ["<rootDir>/tests/app/**/*.test.tsx"],
      setupFilesAfterEnv: ["<rootDir>/tests/app/setup.ts"],
      // The `@/` import alias of tsconfig.json (Metro reads it there; Jest needs it spelled out).
      moduleNameMapper: { "^@/(.*)$": "<rootDir>/$1" },
      transformIgnorePatterns: [
        "node_modules/(?!((jest-)?react-native|@react-native(-community)?)|expo(nent)?|@expo(nent)?/.*|@expo-google-fonts/.*|react-navigation|@react-navigation/.*|@tanstack/.*|react-native-svg|standard-navigation)",
      ],
    },
    {
      displayName: "server",
      testEnvironment: "node",
      testMatch: ["<rootDir>/tests/server/**/*.test.ts", "<rootDir>/tests/shared/**/*.test.ts"],
      transform: { "^.+\\.(t|j)sx?$": swc },
      setupFiles: ["reflect-metadata"],
      setupFilesAfterEnv: ["<rootDir>/tests/server/jest-setup.ts"],
    },
    {
      displayName: "fuzz",
      testEnvironment: "node",
      testMatch: ["<rootDir>/tests/fuzz/**/*.test.ts"],
      transform: { "^.+\\.(t|j)sx?$": swc },
      setupFiles: ["reflect-metadata"],
    },
    {
      // Faults on purpose: MariaDB killed mid-burst (its own mariadbd), the start command restarting what dies.
      displayName: "reliability",
      testEnvironment: "node",
      testMatch: ["<rootDir>/tests/reliability/**/*.test.ts"],
      transform: { "^.+\\.(t|j)sx?$": swc },
      setupFiles: ["reflect-metadata"],
    },
    {
      displayName: "browser",
      testEnvironment: "node",
      testMatch: ["<rootDir>/tests/browser/**/*.test.ts"],
      transform: { "^.+\\.(t|j)sx?$": swc },
    },
  ],
};
