import { useState, type ReactNode } from 'react';
import { Input, Textarea } from '../../../components/ui/input';
import type { FieldControlProps } from '../../../components/ui/field';

interface ListTextInputProps extends FieldControlProps {
  value: readonly string[];
  onChange: (value: string[]) => void;
  onBlur?: () => void;
  /** Splits what was typed into items. */
  split: (text: string) => string[];
  join: (items: readonly string[]) => string;
  multiline?: boolean;
  placeholder?: string;
  children?: (items: readonly string[]) => ReactNode;
}

/**
 * A list edited as plain text (one per line, or separated by commas). The typed text is
 * kept as typed while the form holds the parsed list, so nothing jumps under the cursor.
 */
export function ListTextInput({
  value,
  onChange,
  onBlur,
  split,
  join,
  multiline,
  placeholder,
  children,
  ...control
}: ListTextInputProps) {
  const [text, setText] = useState(() => join(value));
  const [lastValue, setLastValue] = useState(value);
  // A reset from outside (e.g. the saved chemical arriving) replaces the text.
  if (value !== lastValue) {
    setLastValue(value);
    if (join(split(text)) !== join(value)) setText(join(value));
  }

  function handleChange(next: string) {
    setText(next);
    const items = split(next);
    setLastValue(items);
    onChange(items);
  }

  return (
    <>
      {multiline ? (
        <Textarea
          {...control}
          rows={3}
          value={text}
          placeholder={placeholder}
          onChange={(event) => handleChange(event.target.value)}
          onBlur={onBlur}
        />
      ) : (
        <Input
          {...control}
          value={text}
          placeholder={placeholder}
          onChange={(event) => handleChange(event.target.value)}
          onBlur={onBlur}
        />
      )}
      {children?.(value)}
    </>
  );
}
