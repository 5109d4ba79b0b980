/** Sets the browser tab's title (React hoists <title> into the document head). */
export function PageTitle({ title }: { title: string }) {
  return <title>{`${title} · Stillspan`}</title>;
}
