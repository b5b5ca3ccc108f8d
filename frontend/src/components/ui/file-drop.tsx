import { useId, useState } from 'react';
import type { DragEvent, ReactNode } from 'react';
import { filesFromDrop } from '@/lib/dropped-files';
import { buttonClass } from './button';

interface FileDropProps {
  /** Text of the picker button, also its accessible name. */
  pickLabel: string;
  /** When set, a second button picks a whole folder (Chromium, Firefox, Safari all support it). */
  folderLabel?: string;
  accept?: string;
  multiple?: boolean;
  disabled?: boolean;
  onFiles: (files: File[]) => void;
  children?: ReactNode;
}

const hiddenInput = 'peer sr-only';
// The input is visually hidden, so its focus ring is drawn on the label that looks like a button.
const pickerClass = `${buttonClass('secondary')} cursor-pointer peer-focus-visible:outline-2 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-blueend-500 peer-disabled:cursor-not-allowed peer-disabled:opacity-55`;

/** A drop area with ordinary file inputs inside it, so keyboard users never need to drag. */
export function FileDrop({ pickLabel, folderLabel, accept, multiple, disabled, onFiles, children }: FileDropProps) {
  const id = useId();
  const [over, setOver] = useState(false);

  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    if (disabled) return;
    void filesFromDrop(e.dataTransfer).then((files) => {
      if (files.length > 0) onFiles(multiple ? files : files.slice(0, 1));
    });
  };

  const pick = (list: FileList | null, input: HTMLInputElement) => {
    if (list && list.length > 0) onFiles(Array.from(list));
    // Clearing lets the same file be chosen again after it was removed from the list.
    input.value = '';
  };

  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={onDrop}
      className={`flex flex-col items-center gap-3 rounded-panel border-2 border-dashed px-4 py-6 text-center transition-colors ${
        over ? 'border-ember-500 bg-ember-50' : 'border-paper-400 bg-paper-100/60'
      }`}
    >
      {children}
      <div className="flex flex-wrap items-center justify-center gap-2">
        <span>
          <input id={`${id}-files`} type="file" className={hiddenInput} accept={accept} multiple={multiple} disabled={disabled} onChange={(e) => pick(e.target.files, e.target)} />
          <label htmlFor={`${id}-files`} className={pickerClass}>
            {pickLabel}
          </label>
        </span>
        {folderLabel ? (
          <span>
            <input
              id={`${id}-folder`}
              type="file"
              className={hiddenInput}
              disabled={disabled}
              // React has no prop for this non-standard attribute; setting it on the element works everywhere.
              ref={(el) => el?.setAttribute('webkitdirectory', '')}
              onChange={(e) => pick(e.target.files, e.target)}
            />
            <label htmlFor={`${id}-folder`} className={pickerClass}>
              {folderLabel}
            </label>
          </span>
        ) : null}
      </div>
    </div>
  );
}
