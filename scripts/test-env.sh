# The tests' own ports, database and build folder, so npm test can run beside npm start. Sourced.
export NODE_ENV=production
export E2E_PORT=${E2E_PORT:-3100}
export PORT=$E2E_PORT
export DATABASE_URL=$(database_url brixhouse_test)
export SMTP_PORT=${TEST_SMTP_PORT:-1125}
export MAIL_WEB_PORT=${TEST_MAIL_WEB_PORT:-1180}
export APP_URL=http://127.0.0.1:$E2E_PORT
export NEXTAUTH_URL=$APP_URL
export NEXTAUTH_SECRET=brixhouse-test-secret-not-for-production
export NEXT_DIST_DIR=.next-test
