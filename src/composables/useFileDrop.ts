import { onBeforeUnmount, onMounted, ref } from 'vue';

/** Files dropped anywhere on the window while the calling view is mounted; `active` while dragging over. */
export function useFileDrop(onFiles: (files: File[]) => void, enabled: () => boolean) {
  const active = ref(false);
  let depth = 0;
  const hasFiles = (e: DragEvent) => Array.from(e.dataTransfer?.types ?? []).includes('Files');
  const enter = (e: DragEvent) => {
    if (!enabled() || !hasFiles(e)) return;
    e.preventDefault();
    depth++;
    active.value = true;
  };
  const over = (e: DragEvent) => {
    if (enabled() && hasFiles(e)) e.preventDefault();
  };
  const leave = () => {
    depth = Math.max(0, depth - 1);
    if (depth === 0) active.value = false;
  };
  const drop = (e: DragEvent) => {
    if (!enabled() || !hasFiles(e)) return;
    e.preventDefault();
    depth = 0;
    active.value = false;
    const files = Array.from(e.dataTransfer?.files ?? []);
    if (files.length) onFiles(files);
  };
  onMounted(() => {
    window.addEventListener('dragenter', enter);
    window.addEventListener('dragover', over);
    window.addEventListener('dragleave', leave);
    window.addEventListener('drop', drop);
  });
  onBeforeUnmount(() => {
    window.removeEventListener('dragenter', enter);
    window.removeEventListener('dragover', over);
    window.removeEventListener('dragleave', leave);
    window.removeEventListener('drop', drop);
  });
  return { active };
}
