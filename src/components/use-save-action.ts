"use client";

import { useState } from "react";
import { messageOf } from "./api-client";

/** What a panel says about its last save: done, or why not. */
export type Message = { tone: "error" | "done"; text: string };

/**
 * The saving state and message of a panel that saves by its own button rather than a form (the thermal model,
 * the transfer characteristics): `run` marks it saving, runs the action, and on a failure shows `say(error)`
 * (the server's message unless told otherwise) after `onError` has looked at it.
 */
export function useSaveAction() {
  const [saving, setSaving] = useState(false);
  const [message, setMessage] = useState<Message | null>(null);
  async function run(
    action: () => Promise<void>,
    {
      say = messageOf,
      onError,
    }: { say?: (error: unknown) => string; onError?: (error: unknown) => void } = {},
  ) {
    setSaving(true);
    try {
      await action();
    } catch (error) {
      onError?.(error);
      setMessage({ tone: "error", text: say(error) });
    } finally {
      setSaving(false);
    }
  }
  return { saving, message, setMessage, run };
}
