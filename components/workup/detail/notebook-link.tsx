import { isNotebookUrl } from "@/lib/workups/schemas";

/**
 * The notebook entry's address as a link that opens in a new tab without giving the notebook a handle on this page
 * (noopener) or telling it which record linked to it (noreferrer). An address that does not pass the schema (an old
 * import, say) is shown as text, never as a link.
 */
export function NotebookLink({ url }: { url: string }) {
  if (url === "") return <>—</>;
  if (!isNotebookUrl(url)) return <span className="break-all font-mono text-xs">{url}</span>;
  return (
    <a href={url} target="_blank" rel="noopener noreferrer" className="break-all text-teal-800 underline" data-testid="notebook-link">
      {url}
      <span className="sr-only"> (notebook entry, opens in a new tab)</span>
    </a>
  );
}
