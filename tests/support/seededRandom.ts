// One seeded generator for tests, demo data and benchmarks.
export { seededRandom } from '../../shared/synthesis/seededRandom'
