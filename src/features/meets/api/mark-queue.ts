// Meet-day marks survive a reload or a lost connection: each is kept in localStorage under its
// idempotency key until the server has it, and sent in order when the connection is back.
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { MarkBody, MarkResult } from '../../../../shared/schemas';
import { api, isApiError } from '../../../lib/api-client';
import { meetKeys } from './queries';

export type QueuedMark = Required<Pick<MarkBody, 'key' | 'entryId' | 'lift' | 'attemptNo' | 'weightKg' | 'result'>> & {
  record: boolean;
};

const RETRY_MS = 5_000;
const storageKey = (meetId: number) => `rackturn.meet-day.${meetId}.marks`;

function read(meetId: number): QueuedMark[] {
  try {
    const raw = localStorage.getItem(storageKey(meetId));
    const list: unknown = raw ? JSON.parse(raw) : [];
    return Array.isArray(list) ? (list as QueuedMark[]) : [];
  } catch {
    return [];
  }
}

function write(meetId: number, list: QueuedMark[]) {
  if (list.length) localStorage.setItem(storageKey(meetId), JSON.stringify(list));
  else localStorage.removeItem(storageKey(meetId));
}

export function newMarkKey(): string {
  return typeof crypto !== 'undefined' && 'randomUUID' in crypto
    ? crypto.randomUUID()
    : `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 12)}`;
}

/** Not sent (no connection, server away, signed out): keep the mark and try again later. */
function keepForLater(err: unknown): boolean {
  return isApiError(err) && (err.status === 0 || err.status === 401 || err.status >= 500);
}

export interface MarkQueue {
  waiting: QueuedMark[];
  /** The last send failed for want of a connection. */
  offline: boolean;
  /** Marks the server refused (a rule, or another coach was first), in words for the coach. */
  refused: string[];
  enqueue: (mark: QueuedMark) => void;
  sendNow: () => void;
  dismiss: () => void;
}

export function useMarkQueue(meetId: number): MarkQueue {
  const queryClient = useQueryClient();
  const [waiting, setWaiting] = useState<QueuedMark[]>(() => read(meetId));
  const [offline, setOffline] = useState(false);
  const [refused, setRefused] = useState<string[]>([]);
  const busy = useRef(false);

  const flush = useCallback(async () => {
    if (busy.current) return;
    busy.current = true;
    let changed = false;
    try {
      for (let next = read(meetId)[0]; next; next = read(meetId)[0]) {
        try {
          await api<MarkResult>(`/meets/${meetId}/day/marks`, { method: 'POST', body: next });
          changed = true;
          setOffline(false);
        } catch (err) {
          if (keepForLater(err)) {
            setOffline(true);
            break;
          }
          changed = true;
          setRefused((r) => [...r, err instanceof Error ? err.message : 'A mark was refused.']);
        }
        const key = next.key;
        write(
          meetId,
          read(meetId).filter((m) => m.key !== key),
        );
        setWaiting(read(meetId));
      }
    } finally {
      busy.current = false;
      setWaiting(read(meetId));
      if (changed) await queryClient.invalidateQueries({ queryKey: meetKeys.day(meetId) });
    }
  }, [meetId, queryClient]);

  useEffect(() => {
    void flush();
    const onOnline = () => void flush();
    window.addEventListener('online', onOnline);
    const timer = window.setInterval(() => {
      if (read(meetId).length) void flush();
    }, RETRY_MS);
    return () => {
      window.removeEventListener('online', onOnline);
      window.clearInterval(timer);
    };
  }, [flush, meetId]);

  const enqueue = useCallback(
    (mark: QueuedMark) => {
      write(meetId, [...read(meetId), mark]);
      setWaiting(read(meetId));
      void flush();
    },
    [flush, meetId],
  );

  return {
    waiting,
    offline,
    refused,
    enqueue,
    sendNow: () => void flush(),
    dismiss: () => setRefused([]),
  };
}
