// Unsaved rule edits survive a reload or a closed tab: the text is kept in localStorage per model and base revision
// text, offered again when the editor opens on the same base, and dropped once it is saved or discarded.
import { useCallback, useState } from "react";

interface StoredDraft {
  base: string;
  text: string;
}

const keyOf = (modelId: string) => `emulant:rule-draft:${modelId}`;

function readDraft(modelId: string, base: string): string | null {
  try {
    const raw = localStorage.getItem(keyOf(modelId));
    if (!raw) return null;
    const d = JSON.parse(raw) as StoredDraft;
    return d.base === base && typeof d.text === "string" && d.text !== base ? d.text : null;
  } catch {
    return null;
  }
}

export function useRuleDraft(modelId: string, base: string) {
  const [restored] = useState(() => readDraft(modelId, base));
  const keep = useCallback(
    (text: string) => {
      try {
        if (text === base) localStorage.removeItem(keyOf(modelId));
        else localStorage.setItem(keyOf(modelId), JSON.stringify({ base, text } satisfies StoredDraft));
      } catch {
        // A full or disabled storage only loses the draft copy; the edit itself is still on screen.
      }
    },
    [modelId, base],
  );
  const drop = useCallback(() => {
    try {
      localStorage.removeItem(keyOf(modelId));
    } catch {
      // Nothing to drop when storage is unavailable.
    }
  }, [modelId]);
  return { restored, keep, drop };
}
