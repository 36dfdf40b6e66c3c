import { useEffect, useState, type RefObject } from "react";
import { useQueryClient, type Mutation } from "@tanstack/react-query";

type AnyMutation = Mutation<unknown, unknown, unknown, unknown>;

/**
 * Status moves and publishes bump the vehicle's `version` as a save does, so an editor that kept the record it
 * loaded would meet its own person's move as a conflict. This notes the writes this tab starts beside the editor
 * (the side panel's status buttons, Publish) so the editor can take the record they bring as its new base.
 * `sentBody` holds the body of the editor's own last save, which sets the base itself and so is not counted.
 */
export function useOwnMoves(sentBody: RefObject<unknown>) {
  const qc = useQueryClient();
  const [moves, setMoves] = useState<ReadonlySet<AnyMutation>>(() => new Set());

  useEffect(
    () =>
      qc.getMutationCache().subscribe((event) => {
        if (event.type !== "updated") return;
        const m = event.mutation as AnyMutation;
        if (event.action.type === "pending" && m.state.variables !== sentBody.current) setMoves((s) => new Set(s).add(m));
        // A refused move changed nothing: a newer record after it is someone else's.
        if (event.action.type === "error")
          setMoves((s) => {
            const next = new Set(s);
            next.delete(m);
            return next;
          });
      }),
    [qc, sentBody],
  );

  return {
    /** Has this tab moved or published the vehicle since the editor last took a base? */
    any: moves.size > 0,
    /** The editor has taken the newer record as its base. */
    taken: () => setMoves(new Set()),
  };
}
