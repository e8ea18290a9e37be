// The person's choice of which notifications also come by e-mail; each one always arrives in the app (the bell).
import type { NotificationPreferences } from "@shared/schemas/runs";
import { ApiError } from "@/lib/api-client";
import { useNotificationPreferences, useSaveNotificationPreferences } from "../api/notification-preferences";

const choices: { key: keyof NotificationPreferences; label: string }[] = [
  { key: "emailOnDecision", label: "A reduction I proposed is approved or rejected" },
  { key: "emailOnReviewWaiting", label: "A reduction waits for my review (reviewers and owners)" },
  { key: "emailOnMention", label: "Someone names me with @ in a comment" },
];

export function NotificationSettings() {
  const prefs = useNotificationPreferences();
  const save = useSaveNotificationPreferences();
  if (!prefs.data) return null;
  const current = prefs.data;
  return (
    <fieldset className="space-y-2" data-testid="notification-settings">
      <legend className="mb-2 text-sm text-slate-600">
        Every notification appears under the bell. Also send an e-mail when:
      </legend>
      {choices.map((c) => (
        <label key={c.key} className="flex items-center gap-2 text-sm text-slate-800">
          <input
            type="checkbox"
            checked={current[c.key]}
            disabled={save.isPending}
            onChange={(e) => save.mutate({ ...current, [c.key]: e.target.checked })}
            data-testid={`pref-${c.key}`}
          />
          {c.label}
        </label>
      ))}
      {save.isSuccess && (
        <p role="status" className="text-sm text-emerald-700">
          Saved.
        </p>
      )}
      {save.error && (
        <p role="alert" className="text-sm text-red-800">
          {save.error instanceof ApiError ? save.error.message : "Saving failed"}
        </p>
      )}
    </fieldset>
  );
}
