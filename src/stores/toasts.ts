import { create } from 'zustand';

export type Toast = { id: number; tone: 'success' | 'error' | 'info'; message: string };

type ToastState = {
  toasts: Toast[];
  push: (tone: Toast['tone'], message: string) => void;
  dismiss: (id: number) => void;
};

let nextId = 1;

/** Short confirmations ("Invitation sent"). Dismissed by the reader, never on a timer. */
export const useToasts = create<ToastState>((set) => ({
  toasts: [],
  push: (tone, message) =>
    set((s) => ({ toasts: [...s.toasts.slice(-3), { id: nextId++, tone, message }] })),
  dismiss: (id) => set((s) => ({ toasts: s.toasts.filter((t) => t.id !== id) })),
}));

export const toast = {
  success: (message: string) => useToasts.getState().push('success', message),
  error: (message: string) => useToasts.getState().push('error', message),
  info: (message: string) => useToasts.getState().push('info', message),
};
