import { useEffect } from 'react';

/** Each page names itself in the browser tab and in the history, e.g. "People · Kindloop". */
export function useDocumentTitle(title: string | undefined): void {
  useEffect(() => {
    if (title) document.title = `${title} · Kindloop`;
  }, [title]);
}
