import { computed, ref } from 'vue';
import type { Annotation, Comment, Severity } from '../../shared/schemas/annotation';
import * as annotationsApi from '../api/annotations';
import { useAsync } from './useAsync';

export interface Draft {
  id: number | null;
  startS: number;
  endS: number;
  label: string;
  note: string;
  severity: Severity;
}

/** A capture's marks and comments, with the draft being edited in the mark dialog. */
export function useAnnotations(captureId: number) {
  const { run } = useAsync();
  const items = ref<Annotation[]>([]);
  const comments = ref<Comment[]>([]);
  const draft = ref<Draft | null>(null);

  async function load() {
    const [a, c] = await Promise.all([run(() => annotationsApi.listAnnotations(captureId)), run(() => annotationsApi.listComments(captureId))]);
    if (a) items.value = a.items;
    if (c) comments.value = c.items;
  }
  const visible = computed(() => items.value.filter((a) => a.state !== 'dismissed'));

  function startDraft(startS: number, endS: number) {
    draft.value = { id: null, startS, endS, label: '', note: '', severity: 'warning' };
  }
  function edit(a: Annotation) {
    draft.value = { id: a.id, startS: a.startS, endS: a.endS, label: a.label, note: a.note, severity: a.severity };
  }
  async function saveDraft(d: Draft) {
    const body = { startS: d.startS, endS: d.endS, label: d.label, note: d.note, severity: d.severity };
    const ok = d.id === null ? await run(() => annotationsApi.createAnnotation(captureId, body), { success: 'Mark added' }) : await run(() => annotationsApi.updateAnnotation(d.id!, body), { success: 'Mark saved' });
    if (ok) {
      draft.value = null;
      await load();
    }
  }
  async function setState(a: Annotation, state: 'active' | 'dismissed') {
    if (await run(() => annotationsApi.updateAnnotation(a.id, { state }), { success: state === 'active' ? 'Suggestion accepted' : 'Suggestion dismissed' })) await load();
  }
  async function remove(a: Annotation) {
    await run(() => annotationsApi.deleteAnnotation(a.id), { success: 'Mark deleted' });
    await load();
  }
  async function comment(body: string) {
    if (await run(() => annotationsApi.addComment(captureId, body))) await load();
  }

  const cancelDraft = () => (draft.value = null);

  return { items, comments, visible, draft, load, startDraft, edit, saveDraft, cancelDraft, setState, remove, comment };
}
