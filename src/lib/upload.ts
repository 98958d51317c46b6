/** Multipart upload of one file in the field "file", with the CSRF header like any write. */
import { ApiError } from "./api-client.ts";

export async function uploadFile<T>(url: string, file: File): Promise<T> {
  const form = new FormData();
  form.append("file", file);
  const csrf = document.cookie
    .split("; ")
    .find((c) => c.startsWith("cp_csrf="))
    ?.slice("cp_csrf=".length);
  const res = await fetch(url, {
    method: "POST",
    body: form,
    headers: csrf ? { "x-csrf-token": decodeURIComponent(csrf) } : {},
    credentials: "same-origin",
  });
  const data = await res.json().catch(() => ({}));
  if (!res.ok) throw new ApiError(res.status, data.title ?? res.statusText, data.detail ?? "", data.errors ?? []);
  return data as T;
}
