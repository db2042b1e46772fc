import { Placeholder } from '../../components/ui/page';

export function Component() {
  return <Placeholder title="Meets" />;
}
