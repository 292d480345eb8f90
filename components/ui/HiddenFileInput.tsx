import React, { forwardRef } from "react";

export interface HiddenFileInputProps {
  /** MIME types, e.g. "application/pdf,image/jpeg,image/png". */
  accept: string;
  /** The file a person chose (undefined when they cancelled). */
  onPick: (file: File | undefined) => void;
  /** What a screen reader calls the input. */
  label: string;
  testID?: string;
}

/**
 * The web's file input, hidden: a button calls `ref.current.click()` to open the chooser. The value is
 * cleared after each pick, so choosing the same file again still reports it. Web only.
 */
export const HiddenFileInput = forwardRef<HTMLInputElement, HiddenFileInputProps>(function HiddenFileInput({ accept, onPick, label, testID }, ref) {
  return (
    <input
      ref={ref}
      type="file"
      accept={accept}
      style={{ display: "none" }}
      data-testid={testID}
      aria-label={label}
      onChange={(e) => {
        onPick(e.currentTarget.files?.[0]);
        e.currentTarget.value = "";
      }}
    />
  );
});
