import ReactMarkdown from "react-markdown";

// A technician's short note: paragraphs, emphasis, lists, code and links. Raw HTML is dropped, not rendered.
const ALLOWED = ["p", "strong", "em", "ul", "ol", "li", "code", "a", "br", "blockquote", "h1", "h2", "h3", "del"];

export function MarkdownNote({ markdown }: { markdown: string }) {
  if (!markdown.trim()) return null;
  return (
    <div className="note-md">
      <ReactMarkdown
        skipHtml
        allowedElements={ALLOWED}
        unwrapDisallowed
        components={{ a: ({ node: _node, ...props }) => <a {...props} rel="noopener noreferrer nofollow" target="_blank" /> }}
      >
        {markdown}
      </ReactMarkdown>
    </div>
  );
}
