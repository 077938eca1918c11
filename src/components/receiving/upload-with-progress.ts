import { toApiError, type ApiError } from "./field";

/**
 * POSTs multipart form data with XMLHttpRequest, because fetch reports no upload progress.
 * Resolves with the JSON body of a 2xx answer; rejects with the contract's error otherwise.
 */
export function uploadWithProgress<T>(url: string, body: FormData, onProgress: (fraction: number) => void): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.responseType = "json";
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(1);
        resolve(xhr.response as T);
      } else reject(toApiError(xhr.status, xhr.response) satisfies ApiError);
    };
    xhr.onerror = () => reject(toApiError(0, null));
    xhr.send(body);
  });
}
