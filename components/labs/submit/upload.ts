// Sends one file to POST /api/uploads with XMLHttpRequest, whose upload events (unlike fetch's) report
// progress. Resolves with the status and the parsed JSON body; status 0 means the request never finished.
export interface UploadedFile {
  id: string;
  kind: "image" | "trace";
  contentType: string;
  size: number;
  sha256: string;
  analysis: unknown;
}

export interface UploadOutcome {
  status: number;
  body: unknown;
}

export function sendUpload(file: File, labId: string, onProgress: (fraction: number) => void): { done: Promise<UploadOutcome>; abort: () => void } {
  const xhr = new XMLHttpRequest();
  const done = new Promise<UploadOutcome>((resolve) => {
    xhr.open("POST", "/api/uploads");
    xhr.responseType = "text";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress(Math.min(1, e.loaded / e.total));
    };
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) onProgress(1);
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => resolve({ status: 0, body: null });
    xhr.onabort = () => resolve({ status: -1, body: null });
    const form = new FormData();
    form.append("labId", labId);
    form.append("file", file, file.name);
    xhr.send(form);
  });
  return { done, abort: () => xhr.abort() };
}
