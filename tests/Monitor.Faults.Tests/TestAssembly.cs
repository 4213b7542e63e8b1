// One fault test at a time: the broker test stops RabbitMQ for every connection on the node, and each test starts
// its own service processes on a 2-core machine.
[assembly: CollectionBehavior(DisableTestParallelization = true)]
