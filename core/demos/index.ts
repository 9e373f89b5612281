/** The demo projects (invented scenarios), shared by the command-line solver and the app. */
import type { Project } from '../model/project.ts';
import hillside from './hillside-relay-hut.json' with { type: 'json' };
import riverside from './riverside-pump-station.json' with { type: 'json' };
import coldStore from './cold-store-dc-bus.json' with { type: 'json' };
import harbourClinic from './harbour-clinic-ups.json' with { type: 'json' };

export interface DemoProject {
  /** File stem under core/demos/. */
  id: string;
  title: string;
  summary: string;
  project: Project;
}

const demo = (id: string, raw: unknown): DemoProject => {
  const project = raw as Project;
  return { id, title: project.name, summary: project.description ?? '', project };
};

export const demoProjects: readonly DemoProject[] = [
  demo('hillside-relay-hut', hillside),
  demo('riverside-pump-station', riverside),
  demo('cold-store-dc-bus', coldStore),
  demo('harbour-clinic-ups', harbourClinic),
];
