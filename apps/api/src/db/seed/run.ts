import 'reflect-metadata';
import { createDataSource } from '../data-source';
import { seedDemo } from './seed';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is required');
const ds = createDataSource(url, 2);
await ds.initialize();
console.log(await seedDemo(ds));
await ds.destroy();
