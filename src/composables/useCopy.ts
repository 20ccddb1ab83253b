import { ref } from 'vue';

/** Copies text to the clipboard and says so for a moment; `copied` stays false when the browser refuses. */
export function useCopy() {
  const copied = ref(false);
  async function copy(text: string) {
    try {
      await navigator.clipboard.writeText(text);
      copied.value = true;
      setTimeout(() => (copied.value = false), 2000);
    } catch {
      // No clipboard (a page not served over https or localhost): the text stays selectable in its field.
      copied.value = false;
    }
  }
  return { copied, copy };
}
