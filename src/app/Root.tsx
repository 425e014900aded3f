import { useEffect, useState } from 'react';
import { App } from './App';
import { FieldView } from './field/FieldView';

const isField = () => window.location.hash === '#field';

/** The planner, or the field view at the address #field (one plan, one store, two ways to look at it). */
export function Root() {
  const [field, setField] = useState(isField);
  useEffect(() => {
    const on = () => setField(isField());
    window.addEventListener('hashchange', on);
    return () => window.removeEventListener('hashchange', on);
  }, []);
  return field ? <FieldView /> : <App />;
}
