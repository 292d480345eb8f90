import { useCallback, useState } from "react";
import { messageOf } from "../api/client";

export interface Download<K extends string> {
  /** Fetches and saves the file; `key` names which of a screen's files is on its way (its button shows busy). */
  run: (fetchFile: () => Promise<unknown>, key?: K) => Promise<void>;
  /** The key of the file on its way ("file" when none was given), null when none is. */
  pending: K | "file" | null;
  /** What went wrong with the last try, fit to show a person. */
  error: string | null;
  /** The last try saved its file. */
  done: boolean;
}

/**
 * A button that downloads a file (a PDF, a CSV): busy while it runs, the error beside it when it fails, and
 * done after it saved. Each try starts clean. For the screens' download buttons; forms use useZodForm.
 */
export function useDownload<K extends string = never>(): Download<K> {
  const [pending, setPending] = useState<K | "file" | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const run = useCallback(async (fetchFile: () => Promise<unknown>, key?: K) => {
    setError(null);
    setDone(false);
    setPending(key ?? "file");
    try {
      await fetchFile();
      setDone(true);
    } catch (err) {
      setError(messageOf(err));
    } finally {
      setPending(null);
    }
  }, []);
  return { run, pending, error, done };
}
