/** useDownload (components/forms/useDownload.ts): the download buttons' busy, error and done. */
import { act, renderHook } from "@testing-library/react-native";
import { useDownload } from "../../components/forms/useDownload";
import { ApiError } from "../../components/api/client";

test("busy while the file comes, done after, and each try starts clean", async () => {
  const { result } = renderHook(() => useDownload());
  let finish: () => void = () => undefined;
  let running: Promise<void> = Promise.resolve();
  act(() => {
    running = result.current.run(() => new Promise<void>((resolve) => (finish = resolve)));
  });
  expect(result.current.pending).toBe("file");
  expect(result.current.done).toBe(false);
  await act(async () => {
    finish();
    await running;
  });
  expect(result.current.pending).toBeNull();
  expect(result.current.done).toBe(true);
  expect(result.current.error).toBeNull();
});

test("a failure shows its message and clears the last success; the key says which file was on its way", async () => {
  const { result } = renderHook(() => useDownload<"metric" | "us">());
  await act(() => result.current.run(async () => undefined, "us"));
  expect(result.current.done).toBe(true);
  let fail: (e: unknown) => void = () => undefined;
  let running: Promise<void> = Promise.resolve();
  act(() => {
    running = result.current.run(() => new Promise<void>((_, reject) => (fail = reject)), "metric");
  });
  expect(result.current.pending).toBe("metric");
  expect(result.current.done).toBe(false);
  await act(async () => {
    fail(new ApiError(503, "unavailable", "The PDF service is busy."));
    await running;
  });
  expect(result.current.pending).toBeNull();
  expect(result.current.error).toBe("The PDF service is busy.");
  expect(result.current.done).toBe(false);
});
