import Link from "next/link";

/** "Showing a–b of n" with links to the previous and next page of a list (`?page=N`, other query parameters kept). */
export function Pager({
  path,
  query = {},
  page,
  pageSize,
  total,
}: {
  path: string;
  query?: Record<string, string>;
  page: number;
  pageSize: number;
  total: number;
}) {
  if (total <= pageSize && page === 1) return null;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const href = (n: number) => {
    const q = new URLSearchParams({ ...query, ...(n > 1 ? { page: String(n) } : {}) }).toString();
    return q ? `${path}?${q}` : path;
  };
  const first = Math.min(total, (page - 1) * pageSize + 1);
  const last = Math.min(total, page * pageSize);
  return (
    <nav className="filters" aria-label="Pages" style={{ marginTop: "0.75rem" }}>
      <span>
        {first}–{last} of {total} (page {page} of {pages})
      </span>
      {page > 1 && <Link href={href(page - 1)}>Previous page</Link>}
      {page < pages && <Link href={href(page + 1)}>Next page</Link>}
    </nav>
  );
}
