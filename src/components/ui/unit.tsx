/** A unit in a table heading, kept in its own case ("[m]" is not "[M]") even where headings are set in capitals. */
export function Unit({ children }: { children: string }) {
  return <span className="normal-case tracking-normal">[{children}]</span>;
}
