// Review of one reduction: its state, approve/reject with a comment, re-verification on the server, the history of
// decisions and checks, and a threaded discussion. Buttons a role may not use are not shown at all.
import { useState } from "react";
import type { ReductionComment, ReductionDetail } from "@shared/schemas/reductions";
import { ApiError } from "@/lib/api-client";
import { useAddComment } from "../api/add-comment";
import { useDecideReduction } from "../api/decide-reduction";
import { useVerifyReduction } from "../api/verify-reduction";

const stateStyle = {
  proposed: "bg-amber-50 text-amber-800",
  approved: "bg-emerald-50 text-emerald-800",
  rejected: "bg-red-50 text-red-800",
} as const;

function when(iso: string) {
  return new Date(iso).toLocaleString();
}

export function ReviewStateBadge({ state }: { state: keyof typeof stateStyle }) {
  return (
    <span
      data-testid="review-state"
      className={`rounded-full px-2.5 py-0.5 text-xs font-semibold ${stateStyle[state]}`}
    >
      {state}
    </span>
  );
}

function CommentNode({
  comment,
  all,
  onReply,
  canComment,
}: {
  comment: ReductionComment;
  all: ReductionComment[];
  onReply(id: string): void;
  canComment: boolean;
}) {
  const replies = all.filter((c) => c.parentId === comment.id);
  return (
    <li className="space-y-2">
      <div className="rounded-md bg-slate-50 px-3 py-2">
        <p className="text-xs text-slate-500">
          {comment.author?.displayName ?? "former member"} · {when(comment.createdAt)}
        </p>
        <p className="whitespace-pre-wrap text-sm text-slate-800">{comment.body}</p>
        {canComment && (
          <button
            type="button"
            className="mt-1 text-xs font-medium text-brand-700 hover:underline"
            onClick={() => onReply(comment.id)}
          >
            Reply
          </button>
        )}
      </div>
      {replies.length > 0 && (
        <ul className="ml-6 space-y-2 border-l border-slate-200 pl-3">
          {replies.map((r) => (
            <CommentNode key={r.id} comment={r} all={all} onReply={onReply} canComment={canComment} />
          ))}
        </ul>
      )}
    </li>
  );
}

export interface ReviewPanelProps {
  projectId: string;
  reduction: ReductionDetail;
  canDecide: boolean;
  canComment: boolean;
}

export function ReviewPanel({ projectId, reduction, canDecide, canComment }: ReviewPanelProps) {
  const [decisionComment, setDecisionComment] = useState("");
  const [commentBody, setCommentBody] = useState("");
  const [replyTo, setReplyTo] = useState<string | null>(null);
  const decide = useDecideReduction(projectId, reduction.id);
  const verify = useVerifyReduction(projectId, reduction.id);
  const comment = useAddComment(projectId, reduction.id);
  const error = [decide.error, verify.error, comment.error].find(Boolean);
  const v = reduction.lastVerification;
  const roots = reduction.comments.filter((c) => c.parentId === null);

  return (
    <section className="space-y-4 rounded-lg border border-slate-200 bg-white p-4" data-testid="review-panel">
      <header className="flex flex-wrap items-center gap-3">
        <h2 className="text-lg font-semibold">Review</h2>
        <ReviewStateBadge state={reduction.reviewState} />
        {reduction.decidedBy && (
          <span className="text-xs text-slate-500">
            by {reduction.decidedBy.displayName} · {reduction.decidedAt && when(reduction.decidedAt)}
          </span>
        )}
      </header>
      <p className="text-sm" data-testid="verification">
        {v ? (
          <span className={v.isValid ? "text-emerald-700" : "text-red-700"}>
            Last server check: {v.isValid ? "certificate valid" : "certificate INVALID"} ({v.message}) ·{" "}
            {when(v.checkedAt)}
            {v.checkedBy ? ` · ${v.checkedBy.displayName}` : ""}
          </span>
        ) : (
          <span className="text-slate-500">Not re-verified on the server yet.</span>
        )}
      </p>
      {error && (
        <p role="alert" className="rounded-md bg-red-50 px-3 py-2 text-sm text-red-800">
          {error instanceof ApiError ? error.message : "The request failed"}
        </p>
      )}
      {canDecide && (
        <div className="space-y-2">
          <textarea
            value={decisionComment}
            onChange={(e) => setDecisionComment(e.target.value)}
            maxLength={4000}
            rows={2}
            placeholder="Why (recorded with the decision; needed to reject)"
            className="w-full rounded-md border border-slate-300 px-2 py-1 text-sm"
            data-testid="decision-comment"
          />
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              disabled={decide.isPending}
              onClick={() =>
                decide.mutate(
                  { decision: "approve", comment: decisionComment },
                  { onSuccess: () => setDecisionComment("") },
                )
              }
              className="rounded-md bg-emerald-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-emerald-800 disabled:opacity-50"
              data-testid="approve"
            >
              Approve
            </button>
            <button
              type="button"
              disabled={decide.isPending || decisionComment.trim() === ""}
              title={decisionComment.trim() === "" ? "Write why it is rejected first" : undefined}
              onClick={() =>
                decide.mutate(
                  { decision: "reject", comment: decisionComment },
                  { onSuccess: () => setDecisionComment("") },
                )
              }
              className="rounded-md bg-red-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-red-800 disabled:opacity-50"
              data-testid="reject"
            >
              Reject
            </button>
            <button
              type="button"
              disabled={verify.isPending}
              onClick={() => verify.mutate()}
              className="rounded-md border border-slate-300 px-3 py-1.5 text-sm font-medium text-slate-700 hover:bg-slate-50 disabled:opacity-50"
              data-testid="reverify"
            >
              {verify.isPending ? "Checking…" : "Re-verify on server"}
            </button>
          </div>
        </div>
      )}
      {reduction.events.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold text-slate-700">History</h3>
          <ul className="mt-1 space-y-1 text-sm text-slate-700" data-testid="review-history">
            {reduction.events.map((e) => (
              <li key={e.id}>
                <span className="font-medium">{e.actor?.displayName ?? "former member"}</span>{" "}
                {e.kind === "verify"
                  ? `re-verified (${e.outcome?.isValid ? "valid" : "invalid"})`
                  : e.kind === "approve"
                    ? "approved"
                    : e.kind === "reject"
                      ? "rejected"
                      : "reopened"}
                {e.comment && <>: “{e.comment}”</>} <span className="text-xs text-slate-500">{when(e.createdAt)}</span>
              </li>
            ))}
          </ul>
        </div>
      )}
      <div>
        <h3 className="text-sm font-semibold text-slate-700">Discussion</h3>
        {roots.length === 0 && <p className="text-sm text-slate-500">No comments yet.</p>}
        <ul className="mt-2 space-y-2" data-testid="comments">
          {roots.map((c) => (
            <CommentNode key={c.id} comment={c} all={reduction.comments} onReply={setReplyTo} canComment={canComment} />
          ))}
        </ul>
        {canComment && (
          <form
            className="mt-3 space-y-2"
            onSubmit={(e) => {
              e.preventDefault();
              comment.mutate(
                { body: commentBody, parentId: replyTo ?? undefined },
                {
                  onSuccess: () => {
                    setCommentBody("");
                    setReplyTo(null);
                  },
                },
              );
            }}
          >
            {replyTo && (
              <p className="text-xs text-slate-600">
                Replying to a comment ·{" "}
                <button type="button" className="text-brand-700 hover:underline" onClick={() => setReplyTo(null)}>
                  cancel
                </button>
              </p>
            )}
            <textarea
              value={commentBody}
              onChange={(e) => setCommentBody(e.target.value)}
              maxLength={4000}
              rows={2}
              placeholder="Add a comment (write @ and a member's name to tell them)"
              className="w-full rounded-md border border-slate-300 px-2 py-1 text-sm"
              data-testid="comment-body"
            />
            <button
              type="submit"
              disabled={!commentBody.trim() || comment.isPending}
              className="rounded-md bg-brand-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-brand-800 disabled:opacity-50"
            >
              Post comment
            </button>
          </form>
        )}
      </div>
    </section>
  );
}
