import Papa from 'papaparse';
import { useEffect, useState } from 'react';

export interface CataloguePreview {
  columns: string[];
  rows: Record<string, string>[];
}

const PREVIEW_ROWS = 5;

/**
 * The first rows of a chosen catalogue, read in the browser with the same parsing rules as
 * the server (delimiter sniffed, `#` comments skipped, header names trimmed), so the preview
 * shows what the import will see. Only the first rows are read, however large the file.
 */
export function useCataloguePreview(file: File | null): CataloguePreview | null {
  const [preview, setPreview] = useState<{ file: File; value: CataloguePreview } | null>(null);

  useEffect(() => {
    if (!file) return;
    let current = true;
    Papa.parse<Record<string, string>>(file, {
      header: true,
      preview: PREVIEW_ROWS,
      skipEmptyLines: 'greedy',
      comments: '#',
      transformHeader: (h) => h.trim(),
      complete: (result) => {
        if (!current) return;
        const columns = (result.meta.fields ?? []).filter((c) => c !== '');
        setPreview({ file, value: { columns, rows: result.data } });
      },
    });
    return () => {
      current = false;
    };
  }, [file]);

  return preview && preview.file === file ? preview.value : null;
}
