/** The tab's title (React 19 hoists <title> into the head), always naming Rillmark once. */
export function DocumentTitle({ title }: { title: string }) {
  return <title>{title.includes("Rillmark") ? title : `${title} · Rillmark`}</title>;
}
