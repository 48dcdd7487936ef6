import { Fragment } from "react";
import { linkClass } from "../../../components/link-styles";

const URL_PATTERN = /(https?:\/\/[^\s<>"]+)/g;

/** Splits a trailing sentence mark off a URL ("…/abc." → "…/abc" + "."). */
function trimUrl(candidate: string): [string, string] {
  const match = /[.,;:!?)\]]+$/.exec(candidate);
  if (!match) return [candidate, ""];
  return [candidate.slice(0, match.index), match[0]];
}

/** Plain-text mail with its web addresses made clickable; no HTML from the mail is rendered. */
export function LinkifiedText({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <pre className="font-sans text-sm leading-relaxed whitespace-pre-wrap text-ink-800">
      {parts.map((part, i) => {
        if (i % 2 === 0) return <Fragment key={i}>{part}</Fragment>;
        const [url, rest] = trimUrl(part);
        return (
          <Fragment key={i}>
            <a href={url} className={`${linkClass} break-all`}>
              {url}
            </a>
            {rest}
          </Fragment>
        );
      })}
    </pre>
  );
}
