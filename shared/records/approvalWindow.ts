/**
 * How long a supervisor can undo an approval. Until `approval_final_at` (set from the
 * database's clock at approval) the approval is pending: nothing that depends on it
 * (signing a certificate, a set counted certifiable) treats it as final.
 */
export const APPROVAL_UNDO_WINDOW_S = 10
