import { uploadReceiptSchema } from '@contracts/ingest';
import type { UploadReceipt } from '@contracts/ingest';
import { useMutation } from '@tanstack/react-query';
import { sendForm } from '@/lib/send-form';
import type { BytesSent } from '@/lib/send-form';

export interface UploadSpectraInput {
  files: File[];
  onProgress: (sent: BytesSent) => void;
  signal?: AbortSignal;
}

export function uploadSpectra(campaignId: number, { files, onProgress, signal }: UploadSpectraInput): Promise<UploadReceipt> {
  const form = new FormData();
  for (const file of files) form.append('files', file, file.name);
  return sendForm(`/api/campaigns/${campaignId}/uploads`, form, { schema: uploadReceiptSchema, onProgress, ...(signal ? { signal } : {}) });
}

export const useUploadSpectra = (campaignId: number) =>
  useMutation({ mutationFn: (input: UploadSpectraInput) => uploadSpectra(campaignId, input) });
