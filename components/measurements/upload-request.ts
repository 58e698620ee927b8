/**
 * One multipart upload through XMLHttpRequest: fetch() reports no upload progress,
 * XHR's `upload.onprogress` does. Resolves with the status and the parsed JSON body;
 * rejects only when the server could not be reached.
 */
export type UploadProgress = { loaded: number; total: number };

export type IngestDetail = {
  code: string;
  message: string;
  fileName?: string;
  line?: number;
  column?: number;
  field?: string;
  expected?: string;
  found?: string;
};

export type MappingTarget = { target: string; label: string; units: string[]; required: boolean };

export type MappingDetail = { headers: string[]; preview: string[][]; targets: Record<string, MappingTarget[]> };

export type ApiErrorBody = {
  error?: {
    code?: string;
    message?: string;
    details?: { ingest?: IngestDetail; mapping?: MappingDetail; existingSetId?: number; fields?: { field: string; message: string }[] };
  };
};

export type UploadResponse = { status: number; body: unknown };

export function sendUpload(options: {
  url: string;
  form: FormData;
  onProgress: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}): Promise<UploadResponse> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", options.url);
    xhr.responseType = "text";
    xhr.setRequestHeader("accept", "application/json");
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) options.onProgress({ loaded: event.loaded, total: event.total });
    };
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => reject(new Error("Benchfold could not be reached. Check your connection and try again."));
    xhr.onabort = () => reject(new Error("Upload cancelled."));
    options.signal?.addEventListener("abort", () => xhr.abort());
    xhr.send(options.form);
  });
}
