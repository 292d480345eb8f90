import { Platform } from "react-native";

/**
 * Save a file the API made (fetched as a Blob with the bearer token) under a name, through a temporary
 * object URL. Web only: a native build would hand the file to the share sheet instead.
 */
export function saveBlob(blob: Blob, fileName: string): void {
  if (Platform.OS !== "web" || typeof document === "undefined" || typeof URL === "undefined" || !URL.createObjectURL) {
    throw new Error("Downloading files works in the web app.");
  }
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = fileName;
  a.rel = "noopener";
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
