import { uploadDto, type UploadDto } from '../../../../shared/api/weather.schema';
import { ApiError } from '../../../lib/api-client';

/**
 * POST /api/weather/uploads as multipart, with XMLHttpRequest so the browser reports the upload progress
 * (fetch has no upload progress). The answer comes once the file is on the server; the checks run after,
 * and the page polls the upload for them.
 */
export function uploadWeatherFile(
  file: File,
  units: { tempUnit: 'C' | 'F'; rainUnit: 'mm' | 'in' },
  onProgress: (sent: number, total: number) => void,
): { done: Promise<UploadDto>; abort: () => void } {
  const xhr = new XMLHttpRequest();
  const done = new Promise<UploadDto>((resolve, reject) => {
    xhr.open('POST', '/api/weather/uploads');
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.responseType = 'text';
    xhr.upload.onprogress = (e) => onProgress(e.loaded, e.lengthComputable ? e.total : file.size);
    xhr.onerror = () => reject(new ApiError(0, 'network_error', 'The upload was interrupted. Check the connection and try again.'));
    xhr.onabort = () => reject(new ApiError(0, 'aborted', 'The upload was cancelled.'));
    xhr.onload = () => {
      let body: any;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        const parsed = uploadDto.safeParse(body);
        if (parsed.success) resolve(parsed.data);
        else reject(new ApiError(xhr.status, 'invalid_response', 'The server sent an answer Broodcast could not read.'));
      } else {
        const e = body?.error;
        reject(new ApiError(xhr.status, e?.code ?? `http_${xhr.status}`, e?.message ?? `The upload failed (HTTP ${xhr.status}).`, e?.fields ?? [], e?.params ?? {}));
      }
    };
    const form = new FormData();
    form.set('tempUnit', units.tempUnit);
    form.set('rainUnit', units.rainUnit);
    form.set('file', file, file.name);
    xhr.send(form);
  });
  return { done, abort: () => xhr.abort() };
}
