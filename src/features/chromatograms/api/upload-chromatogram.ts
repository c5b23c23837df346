import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { apiErrorSchema } from '@shared/schemas/errors';
import { chromatogramCreatedSchema, type ChromatogramCreated } from '@shared/schemas/chromatograms';
import { parseExact } from '@shared/schemas/exact';
import { ApiError, csrfToken } from '@/api/client';
import { queryKeys } from '@/api/query-keys';
import { api } from '@/paths';

export interface UploadInput {
  file: File;
  stepId: string;
  sampleName: string;
  takenAt?: string;
  signal?: string;
  methodNote?: string;
}

/**
 * Sends the file with XMLHttpRequest, whose upload events give the progress
 * that fetch does not; the reply is parsed exactly like every other one.
 */
export function uploadChromatogram(
  workspaceId: string,
  routeId: string,
  input: UploadInput,
  onProgress: (fraction: number) => void,
  signal?: AbortSignal,
): Promise<ChromatogramCreated> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.set('stepId', input.stepId);
    form.set('sampleName', input.sampleName);
    if (input.takenAt) form.set('takenAt', input.takenAt);
    if (input.signal) form.set('signal', input.signal);
    if (input.methodNote) form.set('methodNote', input.methodNote);
    form.set('file', input.file, input.file.name);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', api.chromatograms.upload(workspaceId, routeId));
    xhr.setRequestHeader('Accept', 'application/json');
    const csrf = csrfToken();
    if (csrf) xhr.setRequestHeader('X-CSRF-Token', csrf);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onerror = () =>
      reject(
        new ApiError(0, {
          code: 'network_error',
          message: 'The server could not be reached. Check your connection and try again.',
        }),
      );
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    xhr.onload = () => {
      let payload: unknown;
      try {
        payload = JSON.parse(xhr.responseText);
      } catch {
        payload = undefined;
      }
      if (xhr.status === 201) {
        const parsed = parseExact(chromatogramCreatedSchema, payload);
        if (parsed.success) resolve(parsed.data);
        else
          reject(
            new ApiError(xhr.status, {
              code: 'invalid_reply',
              message:
                'The server sent a reply this page does not understand. Reload and try again.',
            }),
          );
        return;
      }
      const error = parseExact(apiErrorSchema, payload);
      reject(
        new ApiError(
          xhr.status,
          error.success
            ? error.data.error
            : { code: 'unexpected_reply', message: `The server answered ${xhr.status}.` },
        ),
      );
    };
    signal?.addEventListener('abort', () => xhr.abort());
    xhr.send(form);
  });
}

/** Upload with its progress (0–1, null when idle). */
export function useUploadChromatogram(workspaceId: string, routeId: string) {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState<number | null>(null);
  const mutation = useMutation({
    mutationFn: (input: UploadInput) => {
      setProgress(0);
      return uploadChromatogram(workspaceId, routeId, input, setProgress);
    },
    onSettled: async () => {
      setProgress(null);
      // The step's list and the route-wide one (the wash calibration's choices).
      await queryClient.invalidateQueries({
        queryKey: queryKeys.chromatograms.all(workspaceId, routeId),
      });
    },
  });
  return { ...mutation, progress };
}
