// The photo lane's HTTP: the browser's PUT with progress, and a server's refusal as a failure the
// lane understands (permanent, or worth another try).
export type PutFn = (url: string, headers: Record<string, string>, body: Blob, onProgress: (fraction: number) => void) => Promise<{ status: number }>;

export class UploadFailure extends Error {
  constructor(
    message: string,
    readonly permanent: boolean,
  ) {
    super(message);
  }
}

/** The browser's PUT with upload progress (fetch has none). */
export const xhrPut: PutFn = (url, headers, body, onProgress) =>
  new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("PUT", url);
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => resolve({ status: xhr.status });
    xhr.onerror = () => reject(new TypeError("The upload was interrupted."));
    xhr.ontimeout = () => reject(new TypeError("The upload took too long."));
    xhr.send(body);
  });

async function errorMessage(res: Response): Promise<string | null> {
  try {
    const body = (await res.json()) as { error?: { message?: string } };
    return body.error?.message ?? null;
  } catch {
    return null;
  }
}

/** An HTTP answer that is not a success, as a failure the lane understands. */
export async function failureOf(res: Response, step: string): Promise<UploadFailure> {
  const message = await errorMessage(res);
  if (res.status === 401) return new UploadFailure("Sign in again to upload photos.", false);
  // Refusals that another try cannot fix: the wrong type or size, no permission, the record gone.
  if (res.status === 400 || res.status === 403 || res.status === 404) {
    return new UploadFailure(message ?? `The server refused the photo (${step}).`, true);
  }
  return new UploadFailure(message ?? `The server could not take the photo (${step}, ${res.status}); it will try again.`, false);
}
