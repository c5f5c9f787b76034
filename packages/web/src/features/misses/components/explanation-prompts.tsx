/** Questions a parent can ask before writing down the child's words. Our own wording. */
export const EXPLANATION_PROMPTS = [
  'Tell me how you started.',
  'What did you do in this column?',
  'Can you check it again and tell me what you notice?',
] as const;

export function ExplanationPrompts() {
  return (
    <div className="wb-prompts">
      <p className="wb-prompts-title">Questions you can ask</p>
      <ul>
        {EXPLANATION_PROMPTS.map((prompt) => (
          <li key={prompt}>“{prompt}”</li>
        ))}
      </ul>
    </div>
  );
}
