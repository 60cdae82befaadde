import type { ComponentPropsWithRef } from 'react';

import {
  buttonClassName,
  type ButtonSize,
  type ButtonVariant,
} from '@/components/ui/button-styles';

type ButtonProps = ComponentPropsWithRef<'button'> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
};

export function Button({ variant, size, className, type = 'button', ...buttonProps }: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClassName({ variant, size, className })}
      {...buttonProps}
    />
  );
}
