import { create } from 'zustand';

type SessionEndState = {
  /**
   * Why the last session is gone: 'ended' without the person signing out
   * (idle timeout, a password reset, signing out in another tab), so the
   * sign-in page can say why it is shown and lead back to the page; or
   * 'signed-out' by the person, who starts afresh.
   */
  reason: 'ended' | 'signed-out' | null;
};

export const useSessionEnd = create<SessionEndState>(() => ({ reason: null }));

export const markSessionEnded = () => useSessionEnd.setState({ reason: 'ended' });
export const markSignedOut = () => useSessionEnd.setState({ reason: 'signed-out' });
/** A new session started (signed in, or joined through an invitation). */
export const clearSessionEnd = () => useSessionEnd.setState({ reason: null });
