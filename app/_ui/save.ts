/**
 * Sends a form's JSON to the API (POST to create, PUT to update). On a refusal it hands the
 * server's field errors and message to the form and scrolls to the summary; on success it
 * opens `${pathOf(id)}`. Nothing is stored by the server from a refused body.
 */
type Errors = Record<string, string>;

export interface SaveHandlers {
  setBusy: (b: boolean) => void;
  setErrors: (e: Errors) => void;
  setMessage: (m: string | null) => void;
  router: { push: (href: string) => void; refresh: () => void };
}

export async function saveAndOpen(
  collectionUrl: string,
  id: number | undefined,
  body: unknown,
  pathOf: (id: number) => string,
  h: SaveHandlers,
): Promise<void> {
  h.setBusy(true);
  const res = await fetch(id ? `${collectionUrl}/${id}` : collectionUrl, {
    method: id ? "PUT" : "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
  const out = await res.json().catch(() => ({}));
  if (!res.ok) {
    h.setBusy(false);
    h.setErrors(out.fieldErrors ?? {});
    h.setMessage(out.error ?? `The server answered ${res.status}.`);
    window.scrollTo({ top: 0, behavior: "smooth" });
    return;
  }
  h.router.push(pathOf(out.id));
  h.router.refresh();
}
